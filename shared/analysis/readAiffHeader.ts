import { asciiAt } from './asciiAt'

/** What the header of an AIFF or AIFF-C file declares. */
export interface AiffHeader {
  channels: number
  sampleRate: number
  bitsPerSample: number
  /** AIFF-C compression type ('NONE' for plain AIFF), as the four characters of the file. */
  compression: string
  /** Bytes per frame of uncompressed sample data. */
  blockAlign: number
  /** Frames the COMM chunk declares. */
  framesDeclared: number
  /** Frames the SSND chunk actually holds (at most the declared count). */
  frames: number
}

/** Uncompressed integer encodings: big-endian ('NONE', 'twos') and little-endian ('sowt'). */
export const AIFF_INTEGER_TYPES: ReadonlySet<string> = new Set(['NONE', 'twos', 'sowt'])
/** Uncompressed encodings: the integer ones and float. */
export const AIFF_PCM_TYPES: ReadonlySet<string> = new Set([...AIFF_INTEGER_TYPES, 'fl32', 'FL32', 'fl64', 'FL64'])

/**
 * Read the header of an AIFF or AIFF-C file without decoding it (Apple, Audio Interchange
 * File Format "AIFF" 1.3, 1989; AIFF-C draft, 1991): big-endian chunks in a FORM; COMM gives
 * channels, frames, bits and the rate as an 80-bit IEEE 754 extended float, and AIFF-C adds
 * the compression type; SSND holds the frames after an offset. Returns `null` when the bytes
 * are not a FORM of AIFF or AIFC, and `'corrupt'` when they start like one but COMM or SSND
 * is missing, truncated or inconsistent (COMM after SSND included: recorders write it first,
 * and the decoder reads the samples as they stream in).
 */
export function readAiffHeader(bytes: Uint8Array): AiffHeader | 'corrupt' | null {
  if (bytes.length < 12) return bytes.length >= 4 && asciiAt(bytes, 0, 4) === 'FORM' ? 'corrupt' : null
  const form = asciiAt(bytes, 8, 4)
  if (asciiAt(bytes, 0, 4) !== 'FORM' || (form !== 'AIFF' && form !== 'AIFC')) return null
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength)
  let comm: Omit<AiffHeader, 'frames'> | null = null
  let offset = 12
  while (offset + 8 <= bytes.length) {
    const id = asciiAt(bytes, offset, 4)
    const size = view.getUint32(offset + 4)
    const body = offset + 8
    if (id === 'COMM') {
      if (size < 18 || body + 18 > bytes.length) return 'corrupt'
      const channels = view.getUint16(body)
      const bitsPerSample = view.getUint16(body + 6)
      const compression = form === 'AIFC' && size >= 22 && body + 22 <= bytes.length ? asciiAt(bytes, body + 18, 4) : 'NONE'
      const sampleRate = readExtended(view, body + 8)
      const bytesPerSample = compression === 'fl32' || compression === 'FL32' ? 4 : compression === 'fl64' || compression === 'FL64' ? 8 : Math.ceil(bitsPerSample / 8)
      comm = { channels, sampleRate, bitsPerSample, compression, blockAlign: channels * bytesPerSample, framesDeclared: view.getUint32(body + 2) }
    }
    else if (id === 'SSND') {
      if (!comm || comm.channels === 0 || comm.blockAlign === 0 || !Number.isFinite(comm.sampleRate) || body + 8 > bytes.length) return 'corrupt'
      const dataStart = body + 8 + view.getUint32(body)
      const present = Math.max(0, Math.min(size - 8, bytes.length - dataStart))
      return { ...comm, frames: Math.min(comm.framesDeclared, Math.floor(present / comm.blockAlign)) }
    }
    offset = body + size + (size % 2)
  }
  return 'corrupt'
}

/** An 80-bit IEEE 754 extended float: sign, 15-bit exponent (bias 16383), 64-bit mantissa with its integer bit. */
function readExtended(view: DataView, at: number): number {
  const signAndExponent = view.getUint16(at)
  const exponent = signAndExponent & 0x7fff
  if (exponent === 0x7fff) return Number.NaN
  const mantissa = view.getUint32(at + 2) * 2 ** 32 + view.getUint32(at + 6)
  const value = mantissa * 2 ** (exponent - 16383 - 63)
  return signAndExponent & 0x8000 ? -value : value
}
