import { describe, expect, it } from 'vitest'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { findStrike } from '../../../../shared/analysis/findStrike'
import { measureFftPartials } from '../../../../shared/analysis/measureFftPartials'
import { planAnalysis } from '../../../../shared/analysis/planAnalysis'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 48000
const truth = [
  { frequencyHz: 261.63, amplitudeDb: -6, decayDbPerS: 15 },
  { frequencyHz: 1046.5, amplitudeDb: -18, decayDbPerS: 30 },
  { frequencyHz: 2616.3, amplitudeDb: -26, decayDbPerS: 45 },
]
const x = synthStrike(truth, { sampleRate, durationS: 3, onsetS: 0.05, noiseDb: -80, seed: 9 })
const strike = findStrike(x, sampleRate, { attackSkipS: 0.005 })
const plan = planAnalysis(x, sampleRate, strike, null, undefined)
const peakDb = 20 * Math.log10(x.reduce((m, v) => Math.max(m, Math.abs(v)), 0))

describe('measureFftPartials', () => {
  const fft = measureFftPartials(x, sampleRate, strike, plan, { peakDb, lossy: false })

  it('finds each partial of a synthetic strike, by ascending frequency, without the merge\'s bookkeeping', () => {
    expect(fft.partials).toHaveLength(3)
    fft.partials.forEach((p, i) => {
      // source: the synthesised truth
      expect(Math.abs(centsBetween(p.frequencyHz, truth[i]!.frequencyHz))).toBeLessThan(0.1)
      expect(p.amplitudeDb).toBeCloseTo(truth[i]!.amplitudeDb, 0)
      expect(p).not.toHaveProperty('refineSpanS')
      expect(p).not.toHaveProperty('strongestFrameDb')
    })
    expect(fft.measured).toHaveLength(plan.bands.length)
  }, 60_000)

  it('reports 80 dB of range, 35 dB for a lossy file', () => {
    const strongest = Math.max(...fft.partials.map(p => p.amplitudeDb))
    expect(fft.dynamicRangeDb).toBe(80)
    expect(fft.minAmplitudeDb).toBeCloseTo(strongest - 80, 9)
    const lossy = measureFftPartials(x, sampleRate, strike, plan, { peakDb, lossy: true })
    expect(lossy.dynamicRangeDb).toBe(35)
    expect(lossy.partials.every(p => p.amplitudeDb >= strongest - 35)).toBe(true)
  }, 60_000)
})
