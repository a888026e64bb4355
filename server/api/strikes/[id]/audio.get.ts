import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/strikes/:id/audio: the recording as it was uploaded. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const strike = await getStrike(useDatabase(), member.workshopId, id)
  const bytes = await useBlobStorage().get(strike.audioKey)
  if (!bytes) fail(404, 'The recording of this strike is not in storage.')
  setResponseHeader(event, 'content-type', strike.audioType)
  setResponseHeader(event, 'content-disposition', `inline; filename="${strike.id}.${strike.audioKey.split('.').pop()}"`)
  return bytes
})
