/**
 * Test helper: a RIFF/WAVE file of any channel count in 16-bit or 24-bit PCM or 32-bit
 * IEEE float, written independently of the engine's own encodeWav so decoding can be
 * checked against it. Channels are given as separate arrays (full scale ±1).
 */
export function writeWav(
  channels: ArrayLike<number>[],
  sampleRate: number,
  format: 'pcm16' | 'pcm24' | 'float32' = 'pcm16',
): Uint8Array {
  const bytesPerSample = format === 'pcm16' ? 2 : format === 'pcm24' ? 3 : 4
  const frames = channels[0]?.length ?? 0
  const blockAlign = bytesPerSample * channels.length
  const dataBytes = frames * blockAlign
  const out = new Uint8Array(44 + dataBytes)
  const view = new DataView(out.buffer)
  // The canonical 44-byte header, field by field in file order (RIFF/WAVE: a string is a
  // four-character code, a number pair is a little-endian integer and its size in bytes).
  const header: (string | [number, 2 | 4])[] = [
    'RIFF', [36 + dataBytes, 4], 'WAVE',
    'fmt ', [16, 4], [format === 'float32' ? 3 : 1, 2], [channels.length, 2], [sampleRate, 4], [sampleRate * blockAlign, 4], [blockAlign, 2], [bytesPerSample * 8, 2],
    'data', [dataBytes, 4],
  ]
  let at = 0
  for (const field of header) {
    if (typeof field === 'string') {
      for (const ch of field) view.setUint8(at++, ch.charCodeAt(0))
      continue
    }
    const [value, size] = field
    if (size === 2) view.setUint16(at, value, true)
    else view.setUint32(at, value, true)
    at += size
  }
  let offset = 44
  for (let i = 0; i < frames; i++) {
    for (const channel of channels) {
      const v = Math.max(-1, Math.min(1, channel[i]!))
      if (format === 'pcm16') view.setInt16(offset, Math.max(-32768, Math.min(32767, Math.round(v * 32768))), true)
      else if (format === 'pcm24') {
        const code = Math.max(-8388608, Math.min(8388607, Math.round(v * 8388608)))
        view.setUint8(offset, code & 0xff)
        view.setUint8(offset + 1, (code >> 8) & 0xff)
        view.setUint8(offset + 2, (code >> 16) & 0xff)
      }
      else view.setFloat32(offset, v, true)
      offset += bytesPerSample
    }
  }
  return out
}
