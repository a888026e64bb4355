import { IdParams } from '#shared/schemas/params'
import { LotAssignSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/lots/:id/pieces: record that these pieces are made from the lot. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'lots:manage')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(LotAssignSchema))
  return assignLot(useDatabase(), member.workshopId, member.userId, id, body.pieceIds)
})
