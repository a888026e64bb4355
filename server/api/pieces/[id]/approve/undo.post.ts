import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** POST /api/pieces/:id/approve/undo: take back a pending approval within its undo window (audited). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:decide')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return undoApproval(useDatabase(), member, id)
})
