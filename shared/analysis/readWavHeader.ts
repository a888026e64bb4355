import { asciiAt } from './asciiAt'

/** What the header of a RIFF/WAVE file declares. */
export interface WavHeader {
  /** WAVE format tag (1 PCM, 3 IEEE float, 0xFFFE extensible). */
  formatTag: number
  channels: number
  sampleRate: number
  bitsPerSample: number
  blockAlign: number
  /** Bytes of sample data declared by the data chunk. */
  dataBytes: number
  /** Bytes of sample data actually present in the file. */
  dataBytesPresent: number
  /** Frames actually present. */
  frames: number
}

/**
 * Read the header of a RIFF/WAVE file without decoding it, so that limits (channels,
 * rate, length) are checked before any work is spent. Returns `null` when the bytes are
 * not RIFF/WAVE at all, and `'corrupt'` when they start like one but the header is
 * truncated or inconsistent.
 */
export function readWavHeader(bytes: Uint8Array): WavHeader | 'corrupt' | null {
  if (bytes.length < 12) return bytes.length >= 4 && asciiAt(bytes, 0, 4) === 'RIFF' ? 'corrupt' : null
  if (asciiAt(bytes, 0, 4) !== 'RIFF' || asciiAt(bytes, 8, 4) !== 'WAVE') return null
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength)
  let offset = 12
  let fmt: Omit<WavHeader, 'dataBytes' | 'dataBytesPresent' | 'frames'> | null = null
  while (offset + 8 <= bytes.length) {
    const id = asciiAt(bytes, offset, 4)
    const size = view.getUint32(offset + 4, true)
    const body = offset + 8
    if (id === 'fmt ') {
      if (size < 16 || body + 16 > bytes.length) return 'corrupt'
      fmt = {
        formatTag: view.getUint16(body, true),
        channels: view.getUint16(body + 2, true),
        sampleRate: view.getUint32(body + 4, true),
        blockAlign: view.getUint16(body + 12, true),
        bitsPerSample: view.getUint16(body + 14, true),
      }
    }
    else if (id === 'data') {
      if (!fmt || fmt.blockAlign === 0 || fmt.channels === 0) return 'corrupt'
      // 0 (a recorder stopped before it wrote the size) or 0xFFFFFFFF (one that streams): the
      // data runs to the end of the file.
      const dataBytesPresent = size === 0 || size === 0xffffffff ? bytes.length - body : Math.min(size, bytes.length - body)
      return { ...fmt, dataBytes: size, dataBytesPresent, frames: Math.floor(dataBytesPresent / fmt.blockAlign) }
    }
    // Chunks are padded to an even size.
    offset = body + size + (size % 2)
  }
  return 'corrupt'
}
