import { z } from 'zod'
import { parseWith } from '#shared/validation'

const Params = z.object({ userId: z.string().uuid('That is not a member id') })

/** DELETE /api/team/:userId: remove a member from this workshop (owner only; not the last owner). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'team:manage')
  const { userId } = await getValidatedRouterParams(event, parseWith(Params))
  return removeMember(useDatabase(), member.workshopId, member.userId, userId)
})
