import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/pieces/:id/geometry: the bar model's geometry of a piece (its own, or its register's default) and material. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return resolvePieceGeometry(useDatabase(), member.workshopId, id)
})
