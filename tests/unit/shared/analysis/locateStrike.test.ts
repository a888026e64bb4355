import { describe, expect, it } from 'vitest'
import { findStrike } from '../../../../shared/analysis/findStrike'
import { locateStrike } from '../../../../shared/analysis/locateStrike'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 48000
const settings = { attackSkipS: 0.005, minProminenceDb: 10, minSpanS: 0.1 }

describe('locateStrike', () => {
  it('gives findStrike\'s span for a strike that dies into a quiet background, with no warning', () => {
    const x = synthStrike([{ frequencyHz: 440, amplitudeDb: -6, decayDbPerS: 40 }], { sampleRate, durationS: 2, onsetS: 0.2, noiseDb: -90, seed: 2 })
    const { strike, warnings } = locateStrike(x, sampleRate, settings)
    expect(warnings).toEqual([])
    expect(strike).toEqual(findStrike(x, sampleRate, { attackSkipS: settings.attackSkipS }))
    // source: the synthesised onset at 0.2 s
    expect(strike.onsetIndex / sampleRate).toBeCloseTo(0.2, 2)
  }, 60_000)

  it('analyses a sound that never falls quiet from its first loud moment to the end, and says so', () => {
    // A steady tone from the first sample: no quiet part to tell the strike from.
    const x = synthStrike([{ frequencyHz: 300, amplitudeDb: -10, decayDbPerS: 0 }], { sampleRate, durationS: 1, noiseDb: -90, seed: 4 })
    const { strike, warnings } = locateStrike(x, sampleRate, settings)
    expect(warnings).toHaveLength(1)
    expect(warnings[0]).toMatch(/never falls to a quiet background/)
    expect(strike.endIndex).toBe(x.length)
    expect(strike.startIndex).toBe(strike.onsetIndex + Math.round(settings.attackSkipS * sampleRate))
  }, 60_000)

  it('returns new values: the same input gives the same span twice', () => {
    const x = synthStrike([{ frequencyHz: 300, amplitudeDb: -10, decayDbPerS: 0 }], { sampleRate, durationS: 1, noiseDb: -90, seed: 4 })
    const first = locateStrike(x, sampleRate, settings)
    const second = locateStrike(x, sampleRate, settings)
    expect(second).toEqual(first)
    expect(second.warnings).not.toBe(first.warnings)
  }, 60_000)

  it('never analyses less than the shortest span', () => {
    const x = synthStrike([{ frequencyHz: 2000, amplitudeDb: -6, decayDbPerS: 600 }], { sampleRate, durationS: 0.5, onsetS: 0.1, noiseDb: -100, seed: 5 })
    const { strike } = locateStrike(x, sampleRate, { ...settings, minSpanS: 0.3 })
    expect(strike.endIndex - strike.startIndex).toBeGreaterThanOrEqual(Math.round(0.3 * sampleRate))
  }, 60_000)
})
