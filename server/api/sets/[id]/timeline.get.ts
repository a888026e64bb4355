import { IdParams } from '#shared/schemas/params'
import { TimelineQuerySchema } from '#shared/schemas/timeline'
import { parseWith } from '#shared/validation'

/** GET /api/sets/:id/timeline: the audit trail of a set and its certificates, newest first, paged (`?page=&pageSize=`). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'sets:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const query = await getValidatedQuery(event, parseWith(TimelineQuerySchema))
  return setTimeline(useDatabase(), member.workshopId, id, query)
})
