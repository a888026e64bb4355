/** Sample encodings the helper writes (RIFF/WAVE: 8-bit PCM is unsigned, the others signed). */
export type WavFormat = 'pcm8' | 'pcm16' | 'pcm24' | 'pcm32' | 'float32' | 'float64'

const BYTES: Record<WavFormat, number> = { pcm8: 1, pcm16: 2, pcm24: 3, pcm32: 4, float32: 4, float64: 8 }
/** KSDATAFORMAT_SUBTYPE_PCM / _IEEE_FLOAT: the format tag, then 00 00 00 00 10 00 80 00 00 AA 00 38 9B 71. */
const GUID_TAIL = [0x00, 0x00, 0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71]

export interface WavOptions {
  /** WAVE_FORMAT_EXTENSIBLE (0xFFFE) with a 40-byte fmt chunk, as many recorders write. */
  extensible?: boolean
  /** The data chunk's size field, when it should state another length than the data written. */
  declaredDataBytes?: number
}

/**
 * Test helper: a RIFF/WAVE file of any channel count and encoding, written independently
 * of the engine's own encodeWav so decoding can be checked against it (source: Microsoft,
 * "Multiple Channel Audio Data and WAVE Files", WAVEFORMATEXTENSIBLE). Channels are given
 * as separate arrays (full scale ±1).
 */
export function writeWav(
  channels: ArrayLike<number>[],
  sampleRate: number,
  format: WavFormat = 'pcm16',
  options: WavOptions = {},
): Uint8Array {
  const bytesPerSample = BYTES[format]
  const float = format.startsWith('float')
  const frames = channels[0]?.length ?? 0
  const blockAlign = bytesPerSample * channels.length
  const dataBytes = frames * blockAlign
  const fmtBytes = options.extensible ? 40 : 16
  const headerBytes = 20 + fmtBytes + 8
  const out = new Uint8Array(headerBytes + dataBytes)
  const view = new DataView(out.buffer)
  const tag = float ? 3 : 1
  // The header field by field in file order: a string is a four-character code, a number
  // pair a little-endian integer and its size in bytes.
  const header: (string | [number, 1 | 2 | 4])[] = [
    'RIFF', [headerBytes - 8 + dataBytes, 4], 'WAVE',
    'fmt ', [fmtBytes, 4], [options.extensible ? 0xfffe : tag, 2], [channels.length, 2], [sampleRate, 4], [sampleRate * blockAlign, 4], [blockAlign, 2], [bytesPerSample * 8, 2],
    ...(options.extensible
      ? [[22, 2], [bytesPerSample * 8, 2], [channels.length === 2 ? 3 : 4, 4], [tag, 2], ...GUID_TAIL.map(b => [b, 1] as [number, 1])] as [number, 1 | 2 | 4][]
      : []),
    'data', [options.declaredDataBytes ?? dataBytes, 4],
  ]
  let at = 0
  for (const field of header) {
    if (typeof field === 'string') {
      for (const ch of field) view.setUint8(at++, ch.charCodeAt(0))
      continue
    }
    const [value, size] = field
    if (size === 1) view.setUint8(at, value)
    else if (size === 2) view.setUint16(at, value, true)
    else view.setUint32(at, value, true)
    at += size
  }
  let offset = headerBytes
  for (let i = 0; i < frames; i++) {
    for (const channel of channels) {
      writeSample(view, offset, Math.max(-1, Math.min(1, channel[i]!)), format)
      offset += bytesPerSample
    }
  }
  return out
}

function writeSample(view: DataView, offset: number, v: number, format: WavFormat): void {
  const code = (bits: number) => Math.max(-(2 ** (bits - 1)), Math.min(2 ** (bits - 1) - 1, Math.round(v * 2 ** (bits - 1))))
  if (format === 'pcm8') view.setUint8(offset, code(8) + 128)
  else if (format === 'pcm16') view.setInt16(offset, code(16), true)
  else if (format === 'pcm24') {
    const c = code(24)
    view.setUint8(offset, c & 0xff)
    view.setUint8(offset + 1, (c >> 8) & 0xff)
    view.setUint8(offset + 2, (c >> 16) & 0xff)
  }
  else if (format === 'pcm32') view.setInt32(offset, code(32), true)
  else if (format === 'float32') view.setFloat32(offset, v, true)
  else view.setFloat64(offset, v, true)
}
