import { describe, expect, it } from 'vitest'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { findLongLookPartials, type LongLookSettings } from '../../../../shared/analysis/findLongLookPartials'
import { longSpectrumPeaks } from '../../../../shared/analysis/longSpectrumPeaks'
import type { MeasuredPartial } from '../../../../shared/analysis/types'
import { synthStrike, type SynthPartial } from '../../../support/synthStrike'

const sampleRate = 48000
const onsetS = 0.05
// A tuned drum of our own scenario: two strong low modes and, higher up, a weaker pair 9 Hz apart
// that a 0.2 s window sees as one lobe (a 4-term Blackman–Harris main lobe is 8 / T Hz wide:
// 40 Hz at 0.2 s, 8 Hz at 1 s; source: Harris 1978, Proc. IEEE 66(1)).
const low: SynthPartial[] = [
  { frequencyHz: 88, amplitudeDb: -10, decayDbPerS: 8 },
  { frequencyHz: 132, amplitudeDb: -14, decayDbPerS: 10 },
]
const pair: SynthPartial[] = [
  { frequencyHz: 250, amplitudeDb: -32, decayDbPerS: 12 },
  { frequencyHz: 259, amplitudeDb: -30, decayDbPerS: 15 },
]
const settings: LongLookSettings = {
  startIndex: Math.round((onsetS + 0.005) * sampleRate),
  length: sampleRate,
  onsetIndex: Math.round(onsetS * sampleRate),
  bandWindowS: 0.2,
  maxAmplitudeDb: 1,
  minAmplitudeDb: -90,
  minDecayDbPerS: 2,
  maxDecayDbPerS: 6000,
  maxModulationHz: 24,
}

/** A partial as the bands report it (only frequency, level and modulation matter to the long look). */
function reported(p: SynthPartial, modulationHz: number | null = null): MeasuredPartial {
  return {
    frequencyHz: p.frequencyHz, amplitudeDb: p.amplitudeDb, decayDbPerS: p.decayDbPerS, t60S: 60 / p.decayDbPerS, r2: 0.99, startS: 0.06, endS: 1.9,
    stabilityCents: 0.01, beatHz: null, snrDb: 60, frames: 30, modulationHz, modulationDepthDb: modulationHz === null ? null : 6,
    crossCheckCents: 0, uncertaintyCents: 0.01, uncertaintyDecayPct: 1,
  }
}

function look(partials: SynthPartial[], held: MeasuredPartial[], seed = 1) {
  const x = synthStrike(partials, { sampleRate, durationS: 2, onsetS, noiseDb: -80, seed })
  const peaks = longSpectrumPeaks(x, sampleRate, { startIndex: settings.startIndex, length: settings.length, minFrequencyHz: 20, maxFrequencyHz: 20000, belowStrongestDb: 30, noiseMarginDb: 20 })
  return findLongLookPartials(x, sampleRate, peaks, held, settings)
}

describe('findLongLookPartials', () => {
  it.each([1, 2, 3])('finds both partials of a pair 9 Hz apart that no track holds, under strong low modes (seed %i)', (seed) => {
    const found = look([...low, ...pair], low.map(p => reported(p)), seed)
    expect(found.map(p => Math.round(p.frequencyHz))).toEqual([250, 259])
    for (const [i, p] of found.entries()) {
      const truth = pair[i]!
      // A steady exponential read over 1 s at 50 dB SNR: far inside the 15 ¢ a manual reading allows.
      expect(Math.abs(centsBetween(p.frequencyHz, truth.frequencyHz))).toBeLessThan(0.1)
      expect(Math.abs(p.decayDbPerS / truth.decayDbPerS - 1)).toBeLessThan(0.05)
      expect(Math.abs(p.amplitudeDb - truth.amplitudeDb)).toBeLessThan(0.5)
      // The pencil confirms it: its reading lies within the uncertainty the partial carries.
      expect(Math.abs(p.crossCheckCents!)).toBeLessThan(0.1)
      expect(p.uncertaintyCents!).toBeLessThan(0.1)
    }
  }, 30_000)

  it('adds nothing the reported partials already hold', () => {
    expect(look([...low, ...pair], [...low, ...pair].map(p => reported(p)))).toEqual([])
  }, 30_000)

  it('leaves out a tremolo\'s sidebands and keeps a lone companion', () => {
    // A 6 Hz amplitude modulation of depth m is the carrier plus two partials of amplitude m/2 at ±6 Hz
    // (the modulation theorem; source: Oppenheim & Willsky, Signals and Systems, 2nd ed. 1997, §8.1).
    const carrier = { frequencyHz: 300, amplitudeDb: -20, decayDbPerS: 10 }
    const half = 20 * Math.log10(0.8 / 2)
    const tremolo = [carrier, { ...carrier, frequencyHz: 294, amplitudeDb: -20 + half }, { ...carrier, frequencyHz: 306, amplitudeDb: -20 + half }]
    expect(look([...low, ...tremolo], [...low, carrier].map(p => reported(p)))).toEqual([])
    // The same carrier with one weak companion 16.6 Hz above and no mirror below: a partial.
    const companion = { frequencyHz: 316.6, amplitudeDb: -36, decayDbPerS: 12 }
    const found = look([...low, carrier, companion], [...low, carrier].map(p => reported(p)))
    expect(found).toHaveLength(1)
    expect(Math.abs(centsBetween(found[0]!.frequencyHz, companion.frequencyHz))).toBeLessThan(0.5)
  }, 30_000)

  it('leaves out a sideband of a reported partial modulated at that rate', () => {
    const carrier = { frequencyHz: 300, amplitudeDb: -20, decayDbPerS: 10 }
    const upper = { frequencyHz: 309, amplitudeDb: -36, decayDbPerS: 10 }
    expect(look([...low, carrier, upper], [...low.map(p => reported(p)), reported(carrier, 9)])).toEqual([])
  }, 30_000)

  it('adds nothing to a lone partial in seeded noise, nor far from any neighbour', () => {
    const x = synthStrike([low[0]!], { sampleRate, durationS: 2, onsetS, noiseDb: -50, seed: 4 })
    const peaks = longSpectrumPeaks(x, sampleRate, { startIndex: settings.startIndex, length: settings.length, minFrequencyHz: 20, maxFrequencyHz: 20000, belowStrongestDb: 30, noiseMarginDb: 20 })
    expect(findLongLookPartials(x, sampleRate, peaks, [reported(low[0]!)], settings)).toEqual([])
    // A strong partial no track reported but with no neighbour inside the bands' main lobe was left out on purpose.
    expect(look([...low, { frequencyHz: 700, amplitudeDb: -20, decayDbPerS: 10 }], low.map(p => reported(p)))).toEqual([])
  }, 30_000)

  it('refuses a window outside the signal', () => {
    expect(() => findLongLookPartials(new Float64Array(1000), sampleRate, [], [], settings)).toThrow(RangeError)
  })
})
