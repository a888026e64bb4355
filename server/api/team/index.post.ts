import { AddMemberSchema } from '#shared/schemas/auth'
import { parseWith } from '#shared/validation'

/** POST /api/team: add a member with a role and a temporary password (owner only). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'team:manage')
  const body = await readValidatedBody(event, parseWith(AddMemberSchema))
  setResponseStatus(event, 201)
  return addMember(useDatabase(), member.workshopId, member.userId, body)
})
