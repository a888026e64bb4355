import { PasswordResetRequestSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** POST /api/auth/forgot-password: public; the same answer, in the same time, for known and unknown addresses. */
export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, parseWith(PasswordResetRequestSchema))
  await limitResetRequests(event, body.email)
  const answer = await withMinimumDuration(400, () => requestPasswordReset(useDatabase(), body.email, siteUrlOf(event), useRuntimeConfig().authSecret))
  kickMailQueue()
  return answer
})
