import { SignUpSchema } from '#shared/schemas/auth'
import { parseWith } from '#shared/validation'

/** POST /api/auth/signup: a new account owning a new workshop; answers a token like sign-in. */
export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, parseWith(SignUpSchema))
  return signUpAndSignIn(body)
})
