import { z } from 'zod'
import { ChangeRoleSchema } from '#shared/schemas/auth'
import { parseWith } from '#shared/validation'

const Params = z.object({ userId: z.string().uuid('That is not a member id') })

/** PATCH /api/team/:userId: change a member's role (owner only; never the last owner away). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'team:manage')
  const { userId } = await getValidatedRouterParams(event, parseWith(Params))
  const { role } = await readValidatedBody(event, parseWith(ChangeRoleSchema))
  return changeRole(useDatabase(), member.workshopId, member.userId, userId, role)
})
