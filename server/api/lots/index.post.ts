import { LotInputSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/lots: record a delivery of raw material. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'lots:manage')
  const body = await readValidatedBody(event, parseWith(LotInputSchema))
  setResponseStatus(event, 201)
  return createLot(useDatabase(), member.workshopId, member.userId, body)
})
