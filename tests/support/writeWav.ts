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
  const text = (offset: number, s: string) => {
    for (let i = 0; i < s.length; i++) out[offset + i] = s.charCodeAt(i)
  }
  text(0, 'RIFF')
  view.setUint32(4, 36 + dataBytes, true)
  text(8, 'WAVE')
  text(12, 'fmt ')
  view.setUint32(16, 16, true)
  view.setUint16(20, format === 'float32' ? 3 : 1, true)
  view.setUint16(22, channels.length, true)
  view.setUint32(24, sampleRate, true)
  view.setUint32(28, sampleRate * blockAlign, true)
  view.setUint16(32, blockAlign, true)
  view.setUint16(34, bytesPerSample * 8, true)
  text(36, 'data')
  view.setUint32(40, dataBytes, true)
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
