import { describe, expect, it } from 'vitest'
import { encodeWav } from '../../../../shared/analysis/encodeWav'
import { readWavHeader } from '../../../../shared/analysis/readWavHeader'

const ascii = (bytes: Uint8Array, offset: number) => String.fromCharCode(...bytes.subarray(offset, offset + 4))

describe('encodeWav', () => {
  const samples = [0, 0.5, -0.5, 1, -1, 2, -3, 1 / 32768]
  const bytes = encodeWav(samples, 44100)
  const view = new DataView(bytes.buffer)

  it('writes the canonical 44-byte PCM header', () => {
    // source: Microsoft/IBM RIFF WAVE spec (1991), canonical PCM header field offsets
    expect(ascii(bytes, 0)).toBe('RIFF')
    expect(view.getUint32(4, true)).toBe(36 + 2 * samples.length) // source: RIFF spec, chunk size = file size − 8
    expect(ascii(bytes, 8)).toBe('WAVE')
    expect(ascii(bytes, 12)).toBe('fmt ')
    expect(view.getUint32(16, true)).toBe(16) // source: RIFF spec, PCM fmt chunk is 16 bytes
    expect(view.getUint16(20, true)).toBe(1) // source: RIFF spec, WAVE_FORMAT_PCM = 1
    expect(view.getUint16(22, true)).toBe(1)
    expect(view.getUint32(24, true)).toBe(44100)
    expect(view.getUint32(28, true)).toBe(88200) // source: RIFF spec, byte rate = rate × block align
    expect(view.getUint16(32, true)).toBe(2) // source: RIFF spec, block align = channels × bits / 8
    expect(view.getUint16(34, true)).toBe(16)
    expect(ascii(bytes, 36)).toBe('data')
    expect(view.getUint32(40, true)).toBe(2 * samples.length)
    expect(bytes.length).toBe(44 + 2 * samples.length)
  })

  it('rounds to 16-bit two\'s-complement codes and clips beyond full scale', () => {
    const codes = samples.map((_, i) => view.getInt16(44 + 2 * i, true))
    // source: 16-bit PCM spans −32768…32767, full scale ±1 = ±32768 (common practice)
    expect(codes).toEqual([0, 16384, -16384, 32767, -32768, 32767, -32768, 1])
  })

  it('reads back through the header reader', () => {
    expect(readWavHeader(bytes)).toEqual({
      formatTag: 1, channels: 1, sampleRate: 44100, bitsPerSample: 16, blockAlign: 2,
      dataBytes: 2 * samples.length, dataBytesPresent: 2 * samples.length, frames: samples.length,
    })
  })

  it('refuses a sample rate that is not a positive integer', () => {
    expect(() => encodeWav([0], 0)).toThrow(RangeError)
    expect(() => encodeWav([0], 44100.5)).toThrow(RangeError)
  })
})
