import { InviteSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** POST /api/team/invitations: e-mail a single-use sign-up link with a role (owner only). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'team:manage')
  const body = await readValidatedBody(event, parseWith(InviteSchema))
  const invitation = await createInvitation(useDatabase(), member, body, siteUrlOf(event), useRuntimeConfig().authSecret)
  kickMailQueue()
  setResponseStatus(event, 201)
  return invitation
})
