import { describe, expect, it } from 'vitest'
import { readAiffHeader } from '../../../../shared/analysis/readAiffHeader'
import { audioFixture } from '../../../support/audioFixture'

describe('readAiffHeader', () => {
  it('reads the COMM chunk of files written by another program', () => {
    // scripts/make-test-audio.sh (sox): 48 kHz mono 16-bit, 0.8 s strike + 0.05 s pad = 40 800 frames.
    expect(readAiffHeader(audioFixture('strike-48k-16bit.aiff'))).toEqual({
      channels: 1, sampleRate: 48000, bitsPerSample: 16, compression: 'NONE', blockAlign: 2, framesDeclared: 40800, frames: 40800,
    })
    // AIFF-C, 44.1 kHz 24-bit: 0.6 s + 0.05 s = 28 665 frames, compression type NONE.
    expect(readAiffHeader(audioFixture('strike-44k1-24bit.aifc'))).toEqual({
      channels: 1, sampleRate: 44100, bitsPerSample: 24, compression: 'NONE', blockAlign: 3, framesDeclared: 28665, frames: 28665,
    })
  })

  it('counts only the frames present in a cut file, and calls a cut header corrupt', () => {
    const cut = readAiffHeader(audioFixture('truncated.aiff'))
    expect(cut).toMatchObject({ framesDeclared: 40800 })
    // 30 000 bytes less what sox writes before the samples (FORM 12, a COMT comment 34, COMM 26,
    // SSND's head 16: 88 bytes), 2 bytes a frame.
    expect(cut !== 'corrupt' && cut?.frames).toBe(Math.floor((30000 - 88) / 2))
    expect(readAiffHeader(audioFixture('truncated-header.aiff'))).toBe('corrupt')
  })

  it('reads the 80-bit extended sample rate exactly for the usual rates', () => {
    // 80-bit IEEE 754 extended: exponent 16383 + e, mantissa with explicit integer bit (from memory).
    for (const rate of [8000, 22050, 44100, 48000, 88200, 96000, 192000]) {
      const bytes = aiffWithRate(rate)
      expect(readAiffHeader(bytes)).toMatchObject({ sampleRate: rate })
    }
  })

  it('is null for what is not an AIFF', () => {
    expect(readAiffHeader(audioFixture('strike-48k-16bit.wav'))).toBeNull()
    expect(readAiffHeader(new TextEncoder().encode('FORM\x00\x00\x00\x04ILBM'))).toBeNull()
  })
})

/** A minimal AIFF: COMM (1 channel, 10 frames, 16 bits, `rate`) and SSND with 10 silent frames. */
function aiffWithRate(rate: number): Uint8Array {
  const bytes = new Uint8Array(12 + 26 + 16 + 20)
  const view = new DataView(bytes.buffer)
  const put = (at: number, text: string) => [...text].forEach((c, i) => (bytes[at + i] = c.charCodeAt(0)))
  put(0, 'FORM')
  view.setUint32(4, bytes.length - 8)
  put(8, 'AIFF')
  put(12, 'COMM')
  view.setUint32(16, 18)
  view.setUint16(20, 1)
  view.setUint32(22, 10)
  view.setUint16(26, 16)
  const exponent = Math.floor(Math.log2(rate))
  view.setUint16(28, 16383 + exponent)
  const mantissa = rate / 2 ** exponent // in [1, 2): the integer bit is the top bit
  view.setUint32(30, Math.round(mantissa * 2 ** 31))
  put(38, 'SSND')
  view.setUint32(42, 8 + 20)
  return bytes
}
