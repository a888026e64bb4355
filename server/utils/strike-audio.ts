import type { Readable } from 'node:stream'
import type { H3Event } from 'h3'
import { getRequestHeader, setResponseHeader, setResponseHeaders, setResponseStatus } from 'h3'
import { containerMedia } from '../../shared/analysis/containerMediaType'
import { detectContainer } from '../../shared/analysis/detectContainer'
import type { Executor } from '../database/client'
import { parseByteRange } from './byte-range'
import { fail } from './http-errors'
import { getStrike } from './pieces'
import type { BlobStorage } from './storage'

/** Enough of the start of a file to tell its container (detectContainer reads 12 bytes). */
const SNIFF_BYTES = 16

async function collect(stream: Readable) {
  const chunks: Buffer[] = []
  for await (const chunk of stream) chunks.push(Buffer.from(chunk))
  return new Uint8Array(Buffer.concat(chunks))
}

/**
 * A strike's recording from whichever store holds it, whole (200) or one byte range
 * (206, for seeking in a player), typed by the server from its own bytes and
 * downloaded unless `inline` asks to play a recognised audio container in place.
 */
export async function strikeAudio(event: H3Event, db: Executor, storage: BlobStorage, workshopId: string, strikeId: string, inline: boolean) {
  const strike = await getStrike(db, workshopId, strikeId)
  const info = await storage.head(strike.audioKey)
  if (!info) fail(404, 'The recording of this strike is not in storage.')
  const ask = parseByteRange(getRequestHeader(event, 'range'), info.size)
  if (ask.kind === 'refused') {
    setResponseHeader(event, 'content-range', `bytes */${info.size}`)
    fail(416, ask.reason)
  }
  const opening = info.size > 0 ? await storage.stream(strike.audioKey, { start: 0, end: Math.min(info.size, SNIFF_BYTES) - 1 }) : null
  if (info.size > 0 && !opening) fail(404, 'The recording of this strike is not in storage.')
  const media = containerMedia(detectContainer(opening ? await collect(opening) : new Uint8Array()))
  const range = ask.kind === 'range' ? ask.range : { start: 0, end: info.size - 1 }
  const body = info.size === 0 ? null : await storage.stream(strike.audioKey, ask.kind === 'range' ? range : undefined)
  if (info.size > 0 && !body) fail(404, 'The recording of this strike is not in storage.')
  const playable = inline && media !== null
  setResponseHeaders(event, {
    'content-type': media?.type ?? 'application/octet-stream',
    'content-disposition': `${playable ? 'inline' : 'attachment'}; filename="${strike.id}.${media?.extension ?? 'bin'}"`,
    'x-content-type-options': 'nosniff',
    // Opened directly, the file gets no script, no styles and no origin of ours.
    'content-security-policy': 'default-src \'none\'; media-src \'self\'; sandbox',
    'accept-ranges': 'bytes',
    'content-length': range.end - range.start + 1,
  })
  if (ask.kind === 'range') {
    setResponseStatus(event, 206)
    setResponseHeader(event, 'content-range', `bytes ${range.start}-${range.end}/${info.size}`)
  }
  return body ?? new Uint8Array()
}
