import { BulkStageSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/pieces/bulk-stage: move many pieces at once, all or none. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:stage')
  const body = await readValidatedBody(event, parseWith(BulkStageSchema))
  return changeStages(useDatabase(), member, body.pieceIds, body.to, body.reason)
})
