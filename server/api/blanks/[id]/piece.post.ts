import { BlankToPieceSchema } from '#shared/schemas/blankRecord'
import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** POST /api/blanks/:id/piece: the blank becomes a piece (its lot, species and measured material go to the piece). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'bench:strike')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const { pieceId } = await readValidatedBody(event, parseWith(BlankToPieceSchema))
  return makePieceFromBlank(useDatabase(), member, id, pieceId)
})
