import { describe, expect, it } from 'vitest'
import { addShortPartials } from '../../../../shared/analysis/addShortPartials'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { expectedPartials } from '../../../../shared/analysis/expectedPartials'
import { foundStrike } from '../../../support/foundStrike'
import { measuredPartial } from '../../../support/partials'

const sampleRate = 44100
// A hard-mallet xylophone bar (our own scenario, as in findShortPartials.test.ts): C5 and its
// tuned ×3 partial of T60 0.1 s (600 dB/s), 34 dB under the fundamental.
// common practice: xylophone bars are tuned 1 : 3; the ×3 partial dies far faster than the fundamental.
const { signal: x, strike } = foundStrike([
  { frequencyHz: 523.25, amplitudeDb: -6, decayDbPerS: 20 },
  { frequencyHz: 1569.75, amplitudeDb: -40, decayDbPerS: 600 },
], { sampleRate, durationS: 1.5, onsetS: 0.05, noiseDb: -70, seed: 1 })
const level = { peakDb: 0, minAmplitudeDb: -90 }
const fundamental = measuredPartial({
  frequencyHz: 523.25, amplitudeDb: -6, decayDbPerS: 20, t60S: 3, endS: 1.9, stabilityCents: 0.01, snrDb: 70, frames: 60,
})

describe('addShortPartials', () => {
  it('adds nothing without a template', () => {
    const out = addShortPartials(x, sampleRate, [fundamental], expectedPartials({}), strike, level)
    expect(out).toEqual({ partials: [fundamental], warnings: [] })
  }, 60_000)

  it('measures a template partial the tracks missed from the first tens of ms, in frequency order, with a warning', () => {
    const partials = [fundamental]
    const out = addShortPartials(x, sampleRate, partials, expectedPartials({ targetHz: 523.25, ratios: [1, 3] }), strike, level)
    expect(partials).toHaveLength(1)
    expect(out.partials).toHaveLength(2)
    expect(out.partials[0]).toBe(fundamental)
    // source: the synthesised truth (1569.75 Hz)
    expect(Math.abs(centsBetween(out.partials[1]!.frequencyHz, 1569.75))).toBeLessThan(1)
    expect(out.warnings[0]).toMatch(/dies too fast for the spectral tracks/)
  }, 60_000)
})
