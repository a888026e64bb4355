import { IdParams } from '#shared/schemas/params'
import { ReopenSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/pieces/:id/reopen: reopen an approved piece, with a reason (audited). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:decide')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const { reason } = await readValidatedBody(event, parseWith(ReopenSchema))
  return reopenPiece(useDatabase(), member, id, reason)
})
