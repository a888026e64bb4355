import type { SignUpInput } from '../../shared/schemas/auth'
import { signUp } from './accounts'
import { createSession } from './sessions'
import { addStarterTemplates } from './templates'

export async function signUpAndSignIn(input: SignUpInput) {
  const db = useDatabase()
  const config = useRuntimeConfig()
  const { user, workshop } = await signUp(db, input, addStarterTemplates)
  const token = await createSession(db, { userId: user.id, workshopId: workshop.id, secret: config.authSecret, maxAgeS: Number(config.sessionMaxAgeS) })
  return { token, workshopId: workshop.id }
}
