import { AcceptInvitationSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/**
 * POST /api/invitations/accept: public; join the workshop with the link's token, once.
 * A new address chooses a password; an existing account must be signed in. Rate-limited like sign-in.
 */
export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, parseWith(AcceptInvitationSchema))
  const signedIn = await optionalUser(event)
  return withTokenAttemptLimit(event, 'invitation', () => acceptInvitation(useDatabase(), body, signedIn, useRuntimeConfig().authSecret))
})
