import { IdParams } from '#shared/schemas/params'
import { PieceGeometryInputSchema } from '#shared/schemas/pieceGeometry'
import { parseWith } from '#shared/validation'

/** PUT /api/pieces/:id/geometry: a piece's geometry and material by hand; members who may strike. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'bench:strike')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(PieceGeometryInputSchema))
  return setPieceGeometry(useDatabase(), member, id, body)
})
