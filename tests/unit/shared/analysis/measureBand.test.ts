import { describe, expect, it } from 'vitest'
import { ENGINE_SETTINGS } from '../../../../shared/analysis/engineSettings'
import { findStrike } from '../../../../shared/analysis/findStrike'
import { measureBand } from '../../../../shared/analysis/measureBand'
import { planAnalysis } from '../../../../shared/analysis/planAnalysis'
import { reportFloor } from '../../../../shared/analysis/reportFloor'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 48000
// Three strong partials and one 70 dB under the strongest (inside an 80 dB range, outside a 35 dB one).
const x = synthStrike([
  { frequencyHz: 330, amplitudeDb: -6, decayDbPerS: 6 },
  { frequencyHz: 910, amplitudeDb: -20, decayDbPerS: 12 },
  { frequencyHz: 1770, amplitudeDb: -30, decayDbPerS: 18 },
  { frequencyHz: 2650, amplitudeDb: -76, decayDbPerS: 10 },
], { sampleRate, durationS: 3, onsetS: 0.05, noiseDb: -130, seed: 12 })
const strike = findStrike(x, sampleRate, { attackSkipS: 0.005 })
const band = planAnalysis(x, sampleRate, strike, null, undefined).bands[0]!
const bounds = { peakDb: 0, peakMarginDb: 1, sampleRate, minFrequencyHz: 20, maxDecayDbPerS: 6000, maxGrowthDbPerS: 1 }

describe('measureBand', () => {
  const plain = measureBand(x, sampleRate, strike, band, ENGINE_SETTINGS)

  it('measures every track of the band', () => {
    expect(plain.partials.map(p => Math.round(p.frequencyHz))).toEqual(expect.arrayContaining([330, 910, 1770, 2650]))
  }, 60_000)

  it('gives the same readings, in the same order, when it knows the reporting floor and every track lies within it', () => {
    const floored = measureBand(x, sampleRate, strike, band, ENGINE_SETTINGS, undefined, undefined, reportFloor(bounds, 80))
    expect(floored).toEqual(plain)
  }, 60_000)

  it('spends only the first refinement step on a track far under the floor; the others are as before', () => {
    const floored = measureBand(x, sampleRate, strike, band, ENGINE_SETTINGS, undefined, undefined, reportFloor(bounds, 35))
    expect(floored.partials.map(p => Math.round(p.frequencyHz))).toEqual(plain.partials.map(p => Math.round(p.frequencyHz)))
    let weak = 0
    floored.partials.forEach((p, i) => {
      if (p.amplitudeDb > -60) expect(p).toEqual(plain.partials[i])
      else {
        // The one-bin step's reading: not the fine one, but within a tenth of a bin of it.
        expect(p.frequencyHz).not.toBe(plain.partials[i]!.frequencyHz)
        expect(Math.abs(p.frequencyHz - plain.partials[i]!.frequencyHz)).toBeLessThan(0.1 / p.refineSpanS)
        weak++
      }
    })
    expect(weak).toBe(1)
  }, 60_000)
})
