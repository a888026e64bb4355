import { SignInSchema } from '#shared/schemas/auth'
import { parseWith } from '#shared/validation'

/** POST /api/auth/login: e-mail and password in, a bearer token out. */
export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, parseWith(SignInSchema))
  return signIn(event, body)
})
