import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/sets/:id/history: the set's life in time order, and its service records. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'sets:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return setHistory(useDatabase(), member.workshopId, id)
})
