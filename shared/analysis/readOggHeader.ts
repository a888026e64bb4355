import type { DeclaredAudio } from './declaredAudio'

const OPUS_RATE = 48000

/**
 * An Ogg Vorbis or Opus stream's identification header (first page) and its length from
 * the granule position of the stream's last page. Vorbis: `\x01vorbis`, version, channels,
 * rate (Vorbis I specification §4.2.2), granule in samples. Opus: `OpusHead`, version,
 * channels, pre-skip, input rate (RFC 7845 §5.1), granule in 48 kHz samples, less the
 * pre-skip (§4). Ogg page layout: RFC 3533 §6. Null when the first page is not one of these.
 */
export function readOggHeader(bytes: Uint8Array): DeclaredAudio | null {
  const first = readPage(bytes, 0)
  if (!first || first.bodyLength < 19) return null
  const body = first.body
  const view = new DataView(bytes.buffer, bytes.byteOffset + body, Math.min(first.bodyLength, bytes.length - body))
  const lastGranule = lastGranuleOf(bytes, first.serial)
  if (text(bytes, body, 7) === '\x01vorbis' && view.byteLength >= 16) {
    const channels = view.getUint8(11)
    const sampleRate = view.getUint32(12, true)
    return { codec: 'vorbis', channels, sampleRate, frames: lastGranule, minDurationS: null }
  }
  if (text(bytes, body, 8) === 'OpusHead') {
    const channels = view.getUint8(9)
    const preSkip = view.getUint16(10, true)
    const frames = lastGranule === null ? null : Math.max(0, lastGranule - preSkip)
    return { codec: 'opus', channels, sampleRate: OPUS_RATE, frames, minDurationS: null }
  }
  return null
}

interface OggPage { serial: number, granule: number | null, body: number, bodyLength: number }

function readPage(bytes: Uint8Array, at: number): OggPage | null {
  if (at + 27 > bytes.length || text(bytes, at, 4) !== 'OggS') return null
  const view = new DataView(bytes.buffer, bytes.byteOffset + at, 27)
  const segments = bytes[at + 26]!
  if (at + 27 + segments > bytes.length) return null
  let bodyLength = 0
  for (let i = 0; i < segments; i++) bodyLength += bytes[at + 27 + i]!
  const low = view.getUint32(6, true)
  const high = view.getInt32(10, true)
  // −1 means no packet ends on this page.
  const granule = high === -1 && low === 0xffffffff ? null : high * 2 ** 32 + low
  return { serial: view.getUint32(14, true), granule, body: at + 27 + segments, bodyLength }
}

/** The granule position of the last page of the stream (searched backwards from the end). */
function lastGranuleOf(bytes: Uint8Array, serial: number): number | null {
  // A page is at most 27 + 255 + 255 × 255 bytes; look a little further than one page.
  const stop = Math.max(0, bytes.length - 4 * 65307)
  for (let at = bytes.length - 27; at >= stop; at--) {
    if (bytes[at] !== 0x4f || bytes[at + 1] !== 0x67 || bytes[at + 2] !== 0x67 || bytes[at + 3] !== 0x53) continue
    const page = readPage(bytes, at)
    if (page && page.serial === serial && page.granule !== null && page.granule >= 0) return page.granule
  }
  return null
}

function text(bytes: Uint8Array, at: number, length: number): string {
  let s = ''
  for (let i = 0; i < length && at + i < bytes.length; i++) s += String.fromCharCode(bytes[at + i]!)
  return s
}
