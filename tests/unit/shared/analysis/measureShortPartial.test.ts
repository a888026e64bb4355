import { describe, expect, it } from 'vitest'
import { measureShortPartial } from '../../../../shared/analysis/measureShortPartial'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'

const sampleRate = 44100
const onset = Math.round(0.05 * sampleRate)
// A hard-mallet xylophone bar: fundamental C5 and its tuned third partial near ×3 dying
// with T60 = 0.1 s (600 dB/s), plus a higher partial.
// common practice: xylophone bars are tuned to a 1:3 ratio (a twelfth); the ×3 partial dies far faster than the fundamental.
const bar = synthStrike([
  { frequencyHz: 523.25, amplitudeDb: -6, decayDbPerS: 20 },
  { frequencyHz: 1569.75, amplitudeDb: -12, decayDbPerS: 600 },
  { frequencyHz: 2880, amplitudeDb: -20, decayDbPerS: 200 },
], { sampleRate, durationS: 1.5, onsetS: 0.05, noiseDb: -70, seed: 4 })
const start = onset + Math.round(0.005 * sampleRate)

describe('measureShortPartial', () => {
  it.each([1569.75, 1576, 1563])('measures a T60 = 0.1 s partial from the first 40 ms (guess %s Hz)', (guessHz) => {
    const p = measureShortPartial(bar, sampleRate, guessHz, { startIndex: start, referenceIndex: onset })!
    expect(p.spanS).toBeLessThanOrEqual(0.04)
    expect(Math.abs(p.frequencyHz - 1569.75)).toBeLessThan(0.05)
    expect(Math.abs(p.decayDbPerS - 600) / 600).toBeLessThan(0.01)
    expect(p.t60S).toBeCloseTo(0.1, 2)
    // The level at the onset, not 13 dB low.
    expect(Math.abs(p.amplitudeDb - -12)).toBeLessThan(0.1)
    expect(p.frequencySdHz).toBeGreaterThan(0)
    expect(p.frequencySdHz).toBeLessThan(0.1)
  })

  it('returns null where only noise lies', () => {
    expect(measureShortPartial(bar, sampleRate, 4000, { startIndex: start })).toBeNull()
  })

  it('refuses a frequency outside the recording\'s band or a bad span', () => {
    expect(() => measureShortPartial(bar, sampleRate, 30000, { startIndex: start })).toThrow(RangeError)
    expect(() => measureShortPartial(bar, sampleRate, 1000, { startIndex: start, spanS: 0 })).toThrow(RangeError)
  })
})
