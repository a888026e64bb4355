import { PieceQuerySchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** GET /api/pieces?set=&stage=&verdict=&assignee=&q=&sort=&page=&pageSize=: one page of pieces and the total. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const query = await getValidatedQuery(event, parseWith(PieceQuerySchema))
  return listPieces(useDatabase(), member, query)
})
