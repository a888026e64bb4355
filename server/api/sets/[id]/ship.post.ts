import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** POST /api/sets/:id/ship: mark a certified set shipped (office or owner). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'sets:ship')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return shipSet(useDatabase(), member.workshopId, member.userId, id)
})
