import { IdParams } from '#shared/schemas/params'
import { ReturnSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/pieces/:id/return: send a piece in review back for rework, with a comment. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:decide')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const { comment } = await readValidatedBody(event, parseWith(ReturnSchema))
  return returnPiece(useDatabase(), member, id, comment)
})
