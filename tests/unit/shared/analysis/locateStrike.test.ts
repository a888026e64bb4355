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

describe('a second strike in the same file', () => {
  const bar = [
    { frequencyHz: 220.1, amplitudeDb: -6, decayDbPerS: 10, phaseRad: 0 },
    { frequencyHz: 874.2, amplitudeDb: -18, decayDbPerS: 35, phaseRad: 1 },
  ]
  const twice = (secondAtS: number, secondGain: number) => {
    const first = synthStrike(bar, { sampleRate, durationS: 3, onsetS: 0.1, noiseDb: -85, seed: 6 })
    const second = synthStrike(bar, { sampleRate, durationS: 3, onsetS: secondAtS })
    return first.map((v, i) => v + secondGain * second[i]!)
  }

  for (const [atS, gain] of [[1.6, 0.5], [2.5, 0.2]] as const) {
    it(`ends the span before a blow at ${atS} s (${gain} of the first) and says so`, () => {
      const { strike, warnings } = locateStrike(twice(atS, gain), sampleRate, settings)
      // source: the synthesised second onset; the span ends 2 ms before it (1 ms blocks).
      expect(strike.endIndex / sampleRate).toBeGreaterThan(atS - 0.0045)
      expect(strike.endIndex / sampleRate).toBeLessThanOrEqual(atS)
      expect(warnings).toEqual([`a second strike at ${atS.toFixed(2)} s: only the first, up to ${(strike.endIndex / sampleRate).toFixed(2)} s, was measured`])
    }, 60_000)
  }

  it('measures a blow louder than what is left of the first from its own onset, with no cut, and names the first', () => {
    const { strike, warnings } = locateStrike(twice(1.1, 1), sampleRate, settings)
    // source: the synthesised second onset at 1.1 s (the first has fallen 10 dB by then).
    expect(strike.onsetIndex / sampleRate).toBeCloseTo(1.1, 3)
    expect(warnings).toEqual([
      'an earlier blow or loud sound at 0.10 s was left out: the strike measured is the loudest, at 1.10 s, and what still rings of the earlier one lies under it; record one strike per take',
    ])
  }, 60_000)

  it('names an earlier strike that died away before a louder one', () => {
    const first = synthStrike(bar, { sampleRate, durationS: 8, onsetS: 0.3, noiseDb: -85, seed: 9 })
    const second = synthStrike(bar, { sampleRate, durationS: 8, onsetS: 5.5 })
    const { strike, warnings } = locateStrike(first.map((v, i) => v + 1.2 * second[i]!), sampleRate, settings)
    // source: the synthesised onsets at 0.3 s and 5.5 s (the first has fallen 52 dB by then).
    expect(strike.onsetIndex / sampleRate).toBeCloseTo(5.5, 2)
    expect(warnings).toHaveLength(1)
    expect(warnings[0]).toMatch(/^an earlier blow or loud sound at 0\.30 s was left out: the strike measured is the loudest, at 5\.50 s/)
  }, 60_000)

  it('takes the strike from its first rise when a deep slow tremolo swells louder later', async () => {
    const { synthRealisticStrike } = await import('../../../../shared/synthesis/synthRealisticStrike')
    // A 2 Hz tremolo of index 0.8 caught on its way down at the blow: its next swell, 0.4 s
    // later, stands 2.4 dB over the first (1.8 / 1.25 less 0.8 dB of decay).
    const x = synthRealisticStrike([
      { frequencyHz: 130.81, amplitudeDb: -8, decayDbPerS: 2, tremolo: { rateHz: 2, index: 0.8, phaseRad: 0.4 * Math.PI } },
      { frequencyHz: 523.24, amplitudeDb: -18, decayDbPerS: 6, tremolo: { rateHz: 2, index: 0.8, phaseRad: 0.4 * Math.PI } },
    ], { sampleRate, durationS: 3, onsetS: 0.1, noiseDb: -85, seed: 8 })
    const { strike, warnings } = locateStrike(x, sampleRate, settings)
    // source: the synthesised onset at 0.1 s and background at -85 dB (the lead-in is not the swell's rise).
    expect(strike.onsetIndex / sampleRate).toBeCloseTo(0.1, 2)
    expect(strike.noiseFloorDb).toBeLessThan(-70)
    expect(warnings).toEqual([])
  }, 60_000)

  it('takes a deep 10 Hz tremolo or a 3 Hz beating pair for one strike', async () => {
    const { synthRealisticStrike } = await import('../../../../shared/synthesis/synthRealisticStrike')
    const tremolo = synthRealisticStrike([{ frequencyHz: 174.6, amplitudeDb: -8, decayDbPerS: 3, tremolo: { rateHz: 10, index: 0.9 } }], { sampleRate, durationS: 3, onsetS: 0.1, noiseDb: -85 })
    const beating = synthStrike([{ frequencyHz: 523, amplitudeDb: -8, decayDbPerS: 4 }, { frequencyHz: 526, amplitudeDb: -8.5, decayDbPerS: 4 }], { sampleRate, durationS: 3, onsetS: 0.1, noiseDb: -85, seed: 3 })
    for (const x of [tremolo, beating]) {
      const { warnings } = locateStrike(x, sampleRate, settings)
      expect(warnings.filter(w => w.includes('second strike'))).toEqual([])
    }
  }, 60_000)
})
