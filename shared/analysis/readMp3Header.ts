import type { DeclaredAudio } from './declaredAudio'
import { skipId3v2 } from './skipId3v2'

// Bit rates in kbit/s by [MPEG-1 | MPEG-2/2.5][layer III, II, I][index] (ISO/IEC 11172-3 §2.4.2.3, 13818-3).
const KBPS: Record<'1' | '2', number[][]> = {
  1: [
    [0, 32, 40, 48, 56, 64, 80, 96, 112, 128, 160, 192, 224, 256, 320],
    [0, 32, 48, 56, 64, 80, 96, 112, 128, 160, 192, 224, 256, 320, 384],
    [0, 32, 64, 96, 128, 160, 192, 224, 256, 288, 320, 352, 384, 416, 448],
  ],
  2: [
    [0, 8, 16, 24, 32, 40, 48, 56, 64, 80, 96, 112, 128, 144, 160],
    [0, 8, 16, 24, 32, 40, 48, 56, 64, 80, 96, 112, 128, 144, 160],
    [0, 32, 48, 56, 64, 80, 96, 112, 128, 144, 160, 176, 192, 224, 256],
  ],
}
const RATES = [44100, 48000, 32000]

/**
 * The first MPEG audio frame header after any ID3v2 tag. With a Xing/Info or VBRI header
 * the frame count gives the exact length; without one, the file cannot be shorter than
 * its size at the highest bit rate of its MPEG version and layer, a bound that never
 * refuses a real recording. Null when no frame header is found at the start.
 */
export function readMp3Header(bytes: Uint8Array): DeclaredAudio | null {
  const at = skipId3v2(bytes)
  if (at + 4 > bytes.length || bytes[at] !== 0xff || (bytes[at + 1]! & 0xe0) !== 0xe0) return null
  const versionBits = (bytes[at + 1]! >> 3) & 0x03 // 3 MPEG-1, 2 MPEG-2, 0 MPEG-2.5
  const layerBits = (bytes[at + 1]! >> 1) & 0x03 // 1 layer III, 2 layer II, 3 layer I
  const rateIndex = (bytes[at + 2]! >> 2) & 0x03
  if (versionBits === 1 || layerBits === 0 || rateIndex === 3) return null
  const mpeg1 = versionBits === 3
  const sampleRate = RATES[rateIndex]! / (mpeg1 ? 1 : versionBits === 2 ? 2 : 4)
  const mono = (bytes[at + 3]! >> 6) === 3
  const channels = mono ? 1 : 2
  const layer = 4 - layerBits // 1, 2 or 3
  const samplesPerFrame = layer === 1 ? 384 : layer === 3 && !mpeg1 ? 576 : 1152
  const frames = vbrFrameCount(bytes, at, mpeg1, mono)
  const declared: DeclaredAudio = { codec: 'mp3', channels, sampleRate, frames: frames === null ? null : frames * samplesPerFrame, minDurationS: null }
  if (frames === null) {
    const maxKbps = Math.max(...KBPS[mpeg1 ? '1' : '2'][3 - layer]!)
    declared.minDurationS = ((bytes.length - at) * 8) / (maxKbps * 1000)
  }
  return declared
}

/** Frames stated by a Xing/Info header (after the side information) or a VBRI header (32 bytes in). */
function vbrFrameCount(bytes: Uint8Array, at: number, mpeg1: boolean, mono: boolean): number | null {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength)
  const xing = at + 4 + (mpeg1 ? (mono ? 17 : 32) : (mono ? 9 : 17))
  const tag = (o: number) => o + 4 <= bytes.length ? String.fromCharCode(bytes[o]!, bytes[o + 1]!, bytes[o + 2]!, bytes[o + 3]!) : ''
  if ((tag(xing) === 'Xing' || tag(xing) === 'Info') && xing + 12 <= bytes.length) {
    const flags = view.getUint32(xing + 4)
    if (flags & 1) return view.getUint32(xing + 8)
  }
  const vbri = at + 4 + 32
  if (tag(vbri) === 'VBRI' && vbri + 18 <= bytes.length) return view.getUint32(vbri + 14)
  return null
}
