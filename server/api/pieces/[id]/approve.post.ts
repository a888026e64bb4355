import { IdParams } from '#shared/schemas/params'
import { ApproveSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/pieces/:id/approve: sign off a piece in review on its latest strike. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:decide')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(ApproveSchema))
  return approvePiece(useDatabase(), member, id, body)
})
