import { InvitationLookupSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** POST /api/invitations/lookup: public; the workshop and role an invitation link is for (token in the body, not the URL; rate-limited like sign-in). */
export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, parseWith(InvitationLookupSchema))
  return withTokenAttemptLimit(event, 'invitation', () => lookupInvitation(useDatabase(), body.token, useRuntimeConfig().authSecret))
})
