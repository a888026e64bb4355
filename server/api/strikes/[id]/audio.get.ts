import { AudioQuerySchema, IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/**
 * GET /api/strikes/:id/audio: the recording, typed by the server from its own bytes
 * (never the type the uploader sent), downloaded unless `?inline=1` asks to play a
 * recognised audio container in place; `Range: bytes=…` gives 206 with that part
 * (416 for a range that cannot be served).
 */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const query = await getValidatedQuery(event, parseWith(AudioQuerySchema))
  return strikeAudio(event, useDatabase(), useBlobStorage(), member.workshopId, id, query.inline === '1')
})
