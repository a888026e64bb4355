import { InviteSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** POST /api/team/invitations: e-mail a single-use sign-up link with a role (owner only). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'team:manage')
  const body = await readValidatedBody(event, parseWith(InviteSchema))
  return answerQueued(event, 201, await createInvitation(useDatabase(), member, body, siteUrlOf(event), useRuntimeConfig().authSecret), kickMailQueue)
})
