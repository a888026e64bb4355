import { describe, expect, it } from 'vitest'
import { prepareMono } from '../../../../shared/analysis/prepareMono'

const sampleRate = 8000
const tone = (offset: number, amplitude = 0.5) => Float64Array.from({ length: 8000 }, (_, i) => offset + amplitude * Math.sin((2 * Math.PI * 440 * i) / sampleRate))

describe('prepareMono', () => {
  it('mixes to mono and removes the DC offset, saying so when it is large; the peak is the strike\'s own', () => {
    const { mono, peakDb, warnings } = prepareMono([tone(0.05), tone(0.05)], sampleRate)
    const mean = mono.reduce((a, b) => a + b, 0) / mono.length
    expect(Math.abs(mean)).toBeLessThan(1e-12)
    // The sine's own amplitude, 0.5 (−6.02 dB), not 0.55: the offset is removed before the peak bounds any partial.
    expect(peakDb).toBeCloseTo(20 * Math.log10(0.5), 2)
    expect(warnings).toEqual(['DC offset: 0.050 of full scale (removed before analysis, so the reading is unaffected; it takes that much headroom from the strike and usually comes from the audio interface\'s input: check it, or try another input)'])
    expect(prepareMono([tone(0.001)], sampleRate).warnings).toEqual([])
  })

  it('asks for more input gain when the strike peaks under −40 dB of full scale', () => {
    // source: 20·log10(0.005) = −46.0 dB; common practice: a recording peaks around −12 dB.
    expect(prepareMono([tone(0, 0.005)], sampleRate).warnings).toEqual(['the strike peaks at -46.0 dB of full scale, so quietly that the recording\'s own noise covers its weaker partials: turn the input gain up (or bring the microphone closer) until it peaks around −12 dB, and strike again'])
    // 20·log10(0.011) = −39.2 dB: quiet, but not that quiet.
    expect(prepareMono([tone(0, 0.011)], sampleRate).warnings).toEqual([])
  })

  it('counts clipped samples', () => {
    expect(prepareMono([tone(0, 1.2).map(v => Math.max(-1, Math.min(1, v)))], sampleRate).warnings[0]).toMatch(/^clipped samples: \d+ \(the recording hit full scale.*turn the input gain down and strike again$/)
  })

  it('refuses silence, damaged samples and recordings outside the limits with plain sentences', () => {
    const refusal = (channels: Float64Array[], rate = sampleRate) => {
      try {
        prepareMono(channels, rate)
      }
      catch (error) {
        return error as { status: number, code: string, message: string }
      }
      return null
    }
    // source: −120 dBFS = 10^(−120/20) = 1e−6 of full scale, the engine's digital silence
    expect(refusal([new Float64Array(8000).fill(5e-7)])).toMatchObject({ status: 422, code: 'silent' })
    // Nothing but a DC offset: no strike in it either.
    expect(refusal([new Float64Array(8000).fill(0.2)])).toMatchObject({ status: 422, code: 'silent' })
    expect(refusal([tone(0).map((v, i) => (i === 100 ? Number.NaN : v))])).toMatchObject({ status: 415, code: 'corrupt_audio' })
    expect(refusal([])).toMatchObject({ status: 422, code: 'no_frames' })
    expect(refusal([tone(0).subarray(0, 800)])).toMatchObject({ status: 422, code: 'too_short' })
    expect(refusal([tone(0)], 4000)?.status).toBe(422)
    for (const error of [refusal([]), refusal([new Float64Array(8000)])]) expect(error!.message).toMatch(/^[A-Z].*\.$/)
  })
})
