import type { DeclaredAudio } from './declaredAudio'

/**
 * The FLAC STREAMINFO block (the first metadata block after `fLaC`): 20-bit sample rate,
 * 3-bit channels − 1, 5-bit bits per sample − 1, 36-bit total samples per channel (0 means
 * unknown). Layout: FLAC format specification, RFC 9639 §8.2. Returns null when the
 * bytes do not start with a readable STREAMINFO.
 */
export function readFlacHeader(bytes: Uint8Array, offset = 0): DeclaredAudio | null {
  const at = offset + 4 + 4
  if (bytes.length < at + 18) return null
  if (bytes[offset] !== 0x66 || bytes[offset + 1] !== 0x4c || bytes[offset + 2] !== 0x61 || bytes[offset + 3] !== 0x43) return null
  // Metadata block header: 1 bit last-block flag, 7 bits type (0 = STREAMINFO), 24 bits length.
  if ((bytes[offset + 4]! & 0x7f) !== 0) return null
  const b = (i: number) => bytes[at + i]!
  const sampleRate = (b(10) << 12) | (b(11) << 4) | (b(12) >> 4)
  const channels = ((b(12) >> 1) & 0x07) + 1
  // 36 bits: 4 low bits of byte 13, then bytes 14..17 (beyond 2^32, so no bit shifts).
  const totalSamples = (b(13) & 0x0f) * 2 ** 32 + ((b(14) << 24) >>> 0) + (b(15) << 16) + (b(16) << 8) + b(17)
  return { codec: 'flac', channels, sampleRate, frames: totalSamples > 0 ? totalSamples : null, minDurationS: null }
}
