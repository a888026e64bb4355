import { IdParams } from '#shared/schemas/params'
import { AssignSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/pieces/:id/assign: give a piece to a member (or to nobody). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:assign')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const { assigneeId } = await readValidatedBody(event, parseWith(AssignSchema))
  return assignPiece(useDatabase(), member, id, assigneeId)
})
