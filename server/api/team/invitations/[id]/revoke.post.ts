import { z } from 'zod'
import { parseWith } from '#shared/validation'

const Params = z.object({ id: z.string().uuid('That is not an invitation id') })

/** POST /api/team/invitations/:id/revoke: the link stops working at once (owner only; audited). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'team:manage')
  const { id } = await getValidatedRouterParams(event, parseWith(Params))
  return revokeInvitation(useDatabase(), member.workshopId, member.userId, id)
})
