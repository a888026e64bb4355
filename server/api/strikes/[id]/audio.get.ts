import { CONTAINER_MEDIA } from '#shared/analysis/containerMediaType'
import { detectContainer } from '#shared/analysis/detectContainer'
import { AudioQuerySchema, IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/**
 * GET /api/strikes/:id/audio: the recording, typed by the server from its own bytes
 * (never the type the uploader sent) and downloaded unless `?inline=1` asks to play a
 * recognised audio container in place.
 */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const query = await getValidatedQuery(event, parseWith(AudioQuerySchema))
  const strike = await getStrike(useDatabase(), member.workshopId, id)
  const bytes = await useBlobStorage().get(strike.audioKey)
  if (!bytes) fail(404, 'The recording of this strike is not in storage.')
  const media = CONTAINER_MEDIA[detectContainer(bytes)]
  const inline = query.inline === '1' && media !== null
  setResponseHeaders(event, {
    'content-type': media?.type ?? 'application/octet-stream',
    'content-disposition': `${inline ? 'inline' : 'attachment'}; filename="${strike.id}.${media?.extension ?? 'bin'}"`,
    'x-content-type-options': 'nosniff',
    // Opened directly, the file gets no script, no styles and no origin of ours.
    'content-security-policy': 'default-src \'none\'; media-src \'self\'; sandbox',
  })
  return bytes
})
