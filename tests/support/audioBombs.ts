/**
 * Hand-written audio files that expand far past their size ("decode bombs") and files whose
 * headers declare more than they hold, for the decode-limit tests. Layouts:
 * FLAC — RFC 9639 (STREAMINFO §8.2, frame header §9.1, CONSTANT subframe §9.2.3, CRC-8
 * poly 0x07 and CRC-16 poly 0x8005); Ogg — RFC 3533 §6 (CRC-32 poly 0x04C11DB7, unreflected);
 * Opus in Ogg — RFC 7845 §5 (OpusHead, OpusTags); Opus TOC byte — RFC 6716 §3.1.
 */

function crc8(bytes: Uint8Array): number {
  let crc = 0
  for (const byte of bytes) {
    crc ^= byte
    for (let i = 0; i < 8; i++) crc = crc & 0x80 ? ((crc << 1) ^ 0x07) & 0xff : (crc << 1) & 0xff
  }
  return crc
}

function crc16(bytes: Uint8Array): number {
  let crc = 0
  for (const byte of bytes) {
    crc ^= byte << 8
    for (let i = 0; i < 8; i++) crc = crc & 0x8000 ? ((crc << 1) ^ 0x8005) & 0xffff : (crc << 1) & 0xffff
  }
  return crc
}

/** FLAC's UTF-8-like coding of a frame number (RFC 9639 §9.1.5). */
function codedNumber(n: number): number[] {
  if (n < 0x80) return [n]
  if (n < 0x800) return [0xc0 | (n >> 6), 0x80 | (n & 0x3f)]
  return [0xe0 | (n >> 12), 0x80 | ((n >> 6) & 0x3f), 0x80 | (n & 0x3f)]
}

const FLAC_RATE_CODES: Record<number, number> = { 44100: 9, 48000: 10, 96000: 11 }

export interface FlacBombOptions {
  sampleRate?: number
  channels?: number
  /** Total samples per channel written into STREAMINFO (0: unknown). */
  declaredFrames: number
  /** Frames actually written, each a CONSTANT subframe per channel. */
  blocks: number
  /** Samples per block (at most 65535). */
  blockSize?: number
  /** The constant sample value (16-bit), or one per block, repeated. */
  value?: number | number[]
}

/** A FLAC stream of CONSTANT subframes: about 15 bytes per block of up to 65 535 samples. */
export function flacBomb(options: FlacBombOptions): Uint8Array {
  const { sampleRate = 48000, channels = 1, declaredFrames, blocks, blockSize = 65535, value = 1000 } = options
  const out: number[] = [0x66, 0x4c, 0x61, 0x43]
  // STREAMINFO, marked as the last metadata block, 34 bytes.
  out.push(0x80, 0, 0, 34)
  const info = new Uint8Array(34)
  const view = new DataView(info.buffer)
  view.setUint16(0, blockSize)
  view.setUint16(2, blockSize)
  // Frame sizes unknown (0), then rate(20) channels−1(3) bps−1(5) total(36).
  const bps = 16
  info[10] = (sampleRate >> 12) & 0xff
  info[11] = (sampleRate >> 4) & 0xff
  info[12] = ((sampleRate & 0x0f) << 4) | ((channels - 1) << 1) | ((bps - 1) >> 4)
  info[13] = (((bps - 1) & 0x0f) << 4) | Math.floor(declaredFrames / 2 ** 32) & 0x0f
  view.setUint32(14, declaredFrames % 2 ** 32)
  out.push(...info)
  for (let n = 0; n < blocks; n++) {
    // Fixed blocking, block size from a 16-bit field (code 7), rate code, independent channels, 16 bit.
    const header = [0xff, 0xf8, (7 << 4) | (FLAC_RATE_CODES[sampleRate] ?? 0), ((channels - 1) << 4) | (4 << 1), ...codedNumber(n), (blockSize - 1) >> 8, (blockSize - 1) & 0xff]
    header.push(crc8(new Uint8Array(header)))
    const frame = [...header]
    const v = Array.isArray(value) ? value[n % value.length]! : value
    for (let c = 0; c < channels; c++) frame.push(0x00, (v >> 8) & 0xff, v & 0xff)
    const crc = crc16(new Uint8Array(frame))
    frame.push(crc >> 8, crc & 0xff)
    out.push(...frame)
  }
  return new Uint8Array(out)
}

function oggCrc(bytes: Uint8Array): number {
  let crc = 0
  for (const byte of bytes) {
    crc ^= byte << 24
    for (let i = 0; i < 8; i++) crc = crc & 0x80000000 ? ((crc << 1) ^ 0x04c11db7) >>> 0 : (crc << 1) >>> 0
  }
  return crc >>> 0
}

/** One Ogg page holding whole packets (each under 255 bytes); granule −1 means none. */
export function oggPage(packets: Uint8Array[], granule: number, sequence: number, flags = 0, serial = 0x7e57): Uint8Array {
  const lacing = packets.flatMap(p => [p.length])
  const bodyLength = packets.reduce((sum, p) => sum + p.length, 0)
  const page = new Uint8Array(27 + lacing.length + bodyLength)
  const view = new DataView(page.buffer)
  page.set([0x4f, 0x67, 0x67, 0x53, 0, flags])
  view.setUint32(6, granule < 0 ? 0xffffffff : granule % 2 ** 32, true)
  view.setUint32(10, granule < 0 ? 0xffffffff : Math.floor(granule / 2 ** 32), true)
  view.setUint32(14, serial, true)
  view.setUint32(18, sequence, true)
  page[26] = lacing.length
  page.set(lacing, 27)
  let at = 27 + lacing.length
  for (const p of packets) {
    page.set(p, at)
    at += p.length
  }
  view.setUint32(22, oggCrc(page), true)
  return page
}

export interface OpusBombOptions {
  channels?: number
  /** Granule position of the last page, in 48 kHz samples. */
  declaredFrames: number
  /** Pages of 250 packets of one 20 ms frame each (TOC byte only: a lost frame the decoder conceals). */
  pages: number
}

/** An Ogg Opus stream whose last granule states `declaredFrames`. */
export function opusBomb(options: OpusBombOptions): Uint8Array {
  const { channels = 1, declaredFrames, pages } = options
  const head = new Uint8Array(19)
  head.set([...'OpusHead'].map(c => c.charCodeAt(0)))
  const hv = new DataView(head.buffer)
  head[8] = 1
  head[9] = channels
  hv.setUint16(10, 312, true)
  hv.setUint32(12, 48000, true)
  const tags = new Uint8Array([...'OpusTags'].map(c => c.charCodeAt(0)).concat([4, 0, 0, 0, 0x74, 0x65, 0x73, 0x74, 0, 0, 0, 0]))
  const parts = [oggPage([head], 0, 0, 0x02), oggPage([tags], 0, 1)]
  // TOC: config 9 (SILK wideband 20 ms), mono/stereo flag, code 0.
  const toc = new Uint8Array([(9 << 3) | (channels === 2 ? 0x04 : 0)])
  for (let p = 0; p < pages; p++) {
    const last = p === pages - 1
    const granule = last ? declaredFrames : Math.min(declaredFrames, (p + 1) * 250 * 960)
    parts.push(oggPage(Array.from({ length: 250 }, () => toc), granule, p + 2, last ? 0x04 : 0))
  }
  const total = parts.reduce((sum, p) => sum + p.length, 0)
  const bytes = new Uint8Array(total)
  let at = 0
  for (const p of parts) {
    bytes.set(p, at)
    at += p.length
  }
  return bytes
}
