import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/strikes/:id/analyses: every result the strike has had, oldest first (without the full analysis; see GET /api/strikes/:id for the current one). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return strikeHistory(useDatabase(), member.workshopId, id)
})
