import { ChangePasswordSchema } from '#shared/schemas/auth'
import { parseWith } from '#shared/validation'

/** POST /api/auth/password: change your own password (required after a temporary one). */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, { allowTemporaryPassword: true })
  const body = await readValidatedBody(event, parseWith(ChangePasswordSchema))
  return changePassword(useDatabase(), user.userId, user.sessionId, body.currentPassword, body.newPassword)
})
