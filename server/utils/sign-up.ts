import type { SignUpInput } from '../../shared/schemas/auth'
import { signUp } from './accounts'
import { createSession } from './sessions'
import { seedNewWorkshop } from './workshop-starter'

export async function signUpAndSignIn(input: SignUpInput) {
  const db = useDatabase()
  const config = useRuntimeConfig()
  const { user, workshop } = await signUp(db, input, seedNewWorkshop)
  const token = await createSession(db, { userId: user.id, workshopId: workshop.id, secret: config.authSecret, maxAgeS: Number(config.sessionMaxAgeS) })
  return { token, workshopId: workshop.id }
}
