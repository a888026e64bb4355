import { describe, expect, it } from 'vitest'
import { AnalysisError } from '../../../../shared/analysis/AnalysisError'
import { analyzeSamples } from '../../../../shared/analysis/analyzeSamples'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 44100
// A glockenspiel-like plate at C6 with its ×2.76 partial (free–free bar, common practice), seeded noise.
const strike = [
  { frequencyHz: 1046.6, amplitudeDb: -8, decayDbPerS: 12 },
  { frequencyHz: 2888.0, amplitudeDb: -22, decayDbPerS: 40 },
]
const x = synthStrike(strike, { sampleRate, durationS: 1.5, onsetS: 0.05, noiseDb: -80, seed: 41 })

describe('analyzeSamples', () => {
  const result = analyzeSamples(x, sampleRate, { note: 'C6', ratios: [1, 2.76], tolerances: [5, 15] })

  it('measures the partials of a synthetic strike', () => {
    expect(result.partials).toHaveLength(2)
    result.partials.forEach((p, i) => {
      expect(Math.abs(centsBetween(p.frequencyHz, strike[i]!.frequencyHz))).toBeLessThan(0.1)
      expect(Math.abs(p.amplitudeDb - strike[i]!.amplitudeDb)).toBeLessThan(0.2)
      expect(Math.abs(p.decayDbPerS / strike[i]!.decayDbPerS - 1)).toBeLessThan(0.03)
    })
    expect(result.onsetS).toBeCloseTo(0.05, 2)
    expect(result).toMatchObject({ sampleRate, channels: 1 })
  })

  it('matches the template against the note\'s frequency', () => {
    // source: ISO 16:1975 with 12-TET, C6 = 1046.502 Hz
    expect(result.target!.fundamentalHz).toBeCloseTo(1046.502, 3)
    expect(result.matches![0]!.cents!).toBeCloseTo(centsBetween(1046.6, 1046.502), 1)
    // 2888 Hz against 2.76 × 1046.502 = 2888.35 Hz: −0.2 ¢.
    expect(result.matches![1]!.cents!).toBeCloseTo(centsBetween(2888, 2.76 * 1046.502), 1)
    expect(result.verdict).toBe('within')
  })

  it('gives the same answer for single-precision samples', () => {
    const single = analyzeSamples(Float32Array.from(x), sampleRate, { note: 'C6', ratios: [1, 2.76], tolerances: [5, 15] })
    single.partials.forEach((p, i) => expect(Math.abs(centsBetween(p.frequencyHz, result.partials[i]!.frequencyHz))).toBeLessThan(0.01))
  })

  it('refuses silence with an AnalysisError', () => {
    expect(() => analyzeSamples(new Float64Array(44100), sampleRate)).toThrow(AnalysisError)
  })
})
