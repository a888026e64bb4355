import { IdParams } from '#shared/schemas/params'
import { TimelineQuerySchema } from '#shared/schemas/timeline'
import { parseWith } from '#shared/validation'

/** GET /api/pieces/:id/timeline: the audit trail of a piece, newest first, paged (`?page=&pageSize=`). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const query = await getValidatedQuery(event, parseWith(TimelineQuerySchema))
  return pieceTimeline(useDatabase(), member.workshopId, id, query)
})
