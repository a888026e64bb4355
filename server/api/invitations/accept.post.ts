import { AcceptInvitationSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** POST /api/invitations/accept: public; join the workshop with the link's token, once. */
export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, parseWith(AcceptInvitationSchema))
  return acceptInvitation(useDatabase(), body, useRuntimeConfig().authSecret)
})
