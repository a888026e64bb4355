import { describe, expect, it } from 'vitest'
import { AnalysisError } from '../../../../shared/analysis/AnalysisError'
import { analyzeSamples } from '../../../../shared/analysis/analyzeSamples'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { correctFrequencyHz } from '../../../../shared/calibration/correctFrequencyHz'
import { measureClockOffset } from '../../../../shared/calibration/measureClockOffset'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'

const sampleRate = 48000
/** A steady tone at −6 dBFS peak (−9.03 dB power) in white noise of −40 dBFS RMS: SNR ≈ 31 dB. */
function referenceTone(frequencyHz: number, durationS: number, seed = 7): Float64Array {
  return synthStrike([{ frequencyHz, amplitudeDb: -6, decayDbPerS: 0 }], { sampleRate, durationS, noiseDb: -40, seed })
}

describe('measureClockOffset', () => {
  // The check of issue 15: a 1000 Hz reference on an input that reads 300 ppm high arrives as 1000·(1 + 300·10⁻⁶) Hz.
  const offset = measureClockOffset(referenceTone(1000 * (1 + 300e-6), 10), sampleRate, 1000)

  it('reads a 300 ppm offset within 2 ppm, with an uncertainty that covers its error', () => {
    expect(offset.offsetPpm).toBeGreaterThan(298)
    expect(offset.offsetPpm).toBeLessThan(302)
    expect(offset.measuredHz).toBeCloseTo(1000.3, 3)
    expect(offset.uncertaintyPpm).toBeGreaterThan(0)
    expect(offset.uncertaintyPpm).toBeLessThan(2)
    expect(Math.abs(offset.offsetPpm - 300)).toBeLessThan(3 * offset.uncertaintyPpm + 0.01)
  })

  it('corrects a 440 Hz strike recorded by the same input to 440 Hz within 0.05 cent', () => {
    const strike = synthStrike([
      { frequencyHz: 440 * (1 + 300e-6), amplitudeDb: -6, decayDbPerS: 6 },
      { frequencyHz: 440 * 4 * (1 + 300e-6), amplitudeDb: -14, decayDbPerS: 12 },
    ], { sampleRate, durationS: 4, onsetS: 0.2, noiseDb: -70, seed: 3 })
    const result = analyzeSamples(strike, sampleRate, { note: 'A4', ratios: [1, 4], tolerances: [5, 10] })
    const fundamental = result.partials.find(p => Math.abs(p.frequencyHz - 440) < 2)!
    expect(fundamental).toBeDefined()
    expect(Math.abs(centsBetween(fundamental.frequencyHz, 440))).toBeGreaterThan(0.4) // uncorrected: 300 ppm ≈ 0.52 ¢ (definition of the cent)
    expect(Math.abs(centsBetween(correctFrequencyHz(fundamental.frequencyHz, offset.offsetPpm), 440))).toBeLessThan(0.05)
  })

  it('reads an input that reads low with its sign, and adds the reference uncertainty', () => {
    const fast = measureClockOffset(referenceTone(440 * (1 - 150e-6), 5, 11), sampleRate, 440, { referenceUncertaintyPpm: 1 })
    expect(fast.offsetPpm).toBeCloseTo(-150, 0)
    expect(fast.uncertaintyPpm).toBeGreaterThanOrEqual(1)
    expect(fast.uncertaintyPpm).toBeLessThan(3)
  })

  it('refuses a tone that is too short, missing, out of reach or out of band, in plain sentences', () => {
    const refused = (run: () => unknown): AnalysisError => {
      try {
        run()
      }
      catch (error) {
        if (error instanceof AnalysisError) return error
        throw error
      }
      throw new Error('not refused')
    }
    expect(refused(() => measureClockOffset(referenceTone(1000, 2), sampleRate, 1000)).code).toBe('reference_too_short')
    const noise = synthStrike([], { sampleRate, durationS: 4, noiseDb: -20, seed: 5 })
    expect(refused(() => measureClockOffset(noise, sampleRate, 1000)).code).toBe('reference_not_found')
    // A 48 kHz recording labelled 44.1 kHz reads 8.8 % high: far beyond the default reach.
    expect(refused(() => measureClockOffset(referenceTone(1088.4, 4), sampleRate, 1000)).code).toBe('reference_not_found')
    const outOfBand = refused(() => measureClockOffset(referenceTone(1000, 4), sampleRate, 30000))
    expect(outOfBand.status).toBe(400)
    expect(outOfBand.message).toMatch(/^A reference tone of 30000 Hz cannot be recorded/)
  })
})

describe('correctFrequencyHz', () => {
  it('undoes the offset exactly', () => {
    expect(correctFrequencyHz(1000 * (1 + 300e-6), 300)).toBeCloseTo(1000, 10) // source: definition of ppm, f·(1 + x)/(1 + x) = f
    expect(correctFrequencyHz(440, 0)).toBe(440)
    expect(() => correctFrequencyHz(0, 10)).toThrow(RangeError)
  })
})
