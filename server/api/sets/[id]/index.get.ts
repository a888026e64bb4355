import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/sets/:id: a set with its pieces and progress toward certifiable. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'sets:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return getSet(useDatabase(), member.workshopId, id)
})
