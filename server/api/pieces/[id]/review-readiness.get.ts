import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/pieces/:id/review-readiness: strikes at the piece's final state, how many the workshop asks for before review, and what to do. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return reviewReadinessOfPiece(useDatabase(), member.workshopId, id)
})
