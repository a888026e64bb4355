import { PasswordResetSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** POST /api/auth/reset-password: public; a new password with a live, single-use reset token (rate-limited like sign-in). */
export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, parseWith(PasswordResetSchema))
  return withTokenAttemptLimit(event, 'password-reset', () => resetPassword(useDatabase(), body, useRuntimeConfig().authSecret))
})
