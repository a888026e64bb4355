import { describe, expect, it } from 'vitest'
import { crossCheckPartials } from '../../../../shared/analysis/crossCheckPartials'
import { findStrike } from '../../../../shared/analysis/findStrike'
import { measureFftPartials } from '../../../../shared/analysis/measureFftPartials'
import { planAnalysis } from '../../../../shared/analysis/planAnalysis'
import { synthStrike } from '../../../support/synthStrike'

describe('crossCheckPartials', () => {
  it('gives every partial its second reading and leaves the FFT path\'s list as it was', () => {
    const sampleRate = 48000
    const x = synthStrike([
      { frequencyHz: 1046.5, amplitudeDb: -18, decayDbPerS: 30 },
      { frequencyHz: 261.63, amplitudeDb: -6, decayDbPerS: 15 },
    ], { sampleRate, durationS: 2.5, onsetS: 0.05, noiseDb: -80, seed: 10 })
    const strike = findStrike(x, sampleRate, { attackSkipS: 0.005 })
    const peakDb = 20 * Math.log10(x.reduce((m, v) => Math.max(m, Math.abs(v)), 0))
    const fft = measureFftPartials(x, sampleRate, strike, planAnalysis(x, sampleRate, strike, null, undefined), { peakDb, lossy: false })
    const before = structuredClone(fft.partials)
    const checked = crossCheckPartials(x, sampleRate, [...fft.partials].reverse(), strike, { peakDb, peakMarginDb: 1, minAmplitudeDb: fft.minAmplitudeDb })
    expect(fft.partials).toEqual(before)
    expect(checked.partials.map(p => p.frequencyHz)).toEqual([...before.map(p => p.frequencyHz)].sort((a, b) => a - b))
    for (const p of checked.partials) {
      // Two independent readings of a clean synthetic partial agree far inside a cent.
      expect(Math.abs(p.crossCheckCents!)).toBeLessThan(0.05)
      expect(p.uncertaintyCents).toBeGreaterThan(0)
      expect(p).not.toHaveProperty('windowS')
      expect(p).not.toHaveProperty('modulationFrom')
    }
    expect(checked.warnings).toEqual([])
  }, 60_000)
})
