import { describe, expect, it } from 'vitest'
import { analyzeSamples } from '../../../../shared/analysis/analyzeSamples'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { correctPartialsHz } from '../../../../shared/calibration/correctPartialsHz'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'
import { measuredPartial } from '../../../support/partials'

describe('correctPartialsHz', () => {
  it('divides every frequency by 1 + ppm·10⁻⁶ and keeps the reading as rawFrequencyHz', () => {
    const read = [measuredPartial({ frequencyHz: 1000.3 }), measuredPartial({ frequencyHz: 4001.2, uncertaintyCents: 0.2 })]
    const corrected = correctPartialsHz(read, 300)
    // source: 1000.3 / 1.0003 = 1000 exactly; 4001.2 / 1.0003 = 4000 (arithmetic of the sign convention)
    expect(corrected[0]!.frequencyHz).toBeCloseTo(1000, 9)
    expect(corrected[1]!.frequencyHz).toBeCloseTo(4000, 9)
    expect(corrected.map(p => p.rawFrequencyHz)).toEqual([1000.3, 4001.2])
    expect(corrected[1]!.uncertaintyCents).toBe(0.2)
    expect(read[0]!.rawFrequencyHz).toBeUndefined()
  })

  it('refuses an offset that is not a number', () => {
    expect(() => correctPartialsHz([measuredPartial()], Number.NaN)).toThrow(RangeError)
    expect(() => correctPartialsHz([measuredPartial()], -1e6)).toThrow(RangeError)
  })

  it('is applied by the engine before matching, so cents and verdicts use the corrected frequency', () => {
    const sampleRate = 48000
    // A 440 Hz bar recorded by an input that reads 300 ppm high; 300 ppm ≈ 0.519 ¢ (1200·log2(1.0003), definition of the cent).
    const strike = synthStrike([
      { frequencyHz: 440 * (1 + 300e-6), amplitudeDb: -6, decayDbPerS: 6 },
      { frequencyHz: 440 * 4 * (1 + 300e-6), amplitudeDb: -14, decayDbPerS: 12 },
    ], { sampleRate, durationS: 4, onsetS: 0.2, noiseDb: -70, seed: 3 })
    const options = { note: 'A4', ratios: [1, 4], tolerances: [0.3, 10] }
    const raw = analyzeSamples(strike, sampleRate, options)
    const corrected = analyzeSamples(strike, sampleRate, { ...options, clockOffsetPpm: 300 })
    expect(raw.matches![0]!.cents!).toBeGreaterThan(0.4)
    expect(raw.matches![0]!.within).toBe(false)
    expect(Math.abs(centsBetween(corrected.fundamentalHz!, 440))).toBeLessThan(0.05)
    expect(Math.abs(corrected.matches![0]!.cents!)).toBeLessThan(0.05)
    expect(corrected.matches![0]!.within).toBe(true)
    expect(corrected.parameters.clockOffsetPpm).toBe(300)
    expect(raw.parameters.clockOffsetPpm).toBeUndefined()
    const fundamental = corrected.partials.find(p => Math.abs(p.frequencyHz - 440) < 2)!
    expect(fundamental.rawFrequencyHz! / fundamental.frequencyHz).toBeCloseTo(1.0003, 7)
  })
})
