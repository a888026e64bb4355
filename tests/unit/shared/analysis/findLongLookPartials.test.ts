import { describe, expect, it } from 'vitest'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { findLongLookPartials, type LongLookSettings } from '../../../../shared/analysis/findLongLookPartials'
import { longSpectrumPeaks } from '../../../../shared/analysis/longSpectrumPeaks'
import type { MeasuredPartial } from '../../../../shared/analysis/types'
import { CLOSE_PAIR, LOW_MODES, reportedPartial } from '../../../support/closeLowPair'
import { synthStrike, type SynthPartial } from '../../../support/synthStrike'

const sampleRate = 48000
const onsetS = 0.05
// Strong low modes and a pair 9 Hz apart that a 0.2 s window cannot resolve (tests/support/closeLowPair.ts).
const low = LOW_MODES
const pair = CLOSE_PAIR
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

const reported = reportedPartial

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

  it('finds a partial whose track weaker neighbours broke up, and takes none of them for a candidate', () => {
    // As addLongLookPartials lists them: peaks down to 50 dB under the strongest and 10 dB over the
    // floor show the neighbours; candidates stay within 30 dB of the strongest and 20 dB over the floor.
    const partial = { frequencyHz: 200, amplitudeDb: -32, decayDbPerS: 12 }
    const neighbour = { frequencyHz: 214, amplitudeDb: -46, decayDbPerS: 15 }
    const x = synthStrike([...low, partial, neighbour], { sampleRate, durationS: 2, onsetS, noiseDb: -80, seed: 5 })
    const peaks = longSpectrumPeaks(x, sampleRate, { startIndex: settings.startIndex, length: settings.length, minFrequencyHz: 20, maxFrequencyHz: 20000, belowStrongestDb: 50, noiseMarginDb: 10 })
    expect(peaks.some(p => Math.abs(p.frequencyHz - neighbour.frequencyHz) < 0.5)).toBe(true)
    const found = findLongLookPartials(x, sampleRate, peaks, low.map(p => reported(p)), { ...settings, belowStrongestDb: 30, noiseMarginDb: 20 })
    expect(found).toHaveLength(1)
    expect(Math.abs(centsBetween(found[0]!.frequencyHz, partial.frequencyHz))).toBeLessThan(0.5)
    // A neighbour more than 20 dB under it moves the bands' lobe too little to break a track: the bands had it.
    const faint = { ...neighbour, amplitudeDb: -56 }
    const y = synthStrike([...low, partial, faint], { sampleRate, durationS: 2, onsetS, noiseDb: -80, seed: 5 })
    const peaksY = longSpectrumPeaks(y, sampleRate, { startIndex: settings.startIndex, length: settings.length, minFrequencyHz: 20, maxFrequencyHz: 20000, belowStrongestDb: 50, noiseMarginDb: 10 })
    expect(findLongLookPartials(y, sampleRate, peaksY, low.map(p => reported(p)), { ...settings, belowStrongestDb: 30, noiseMarginDb: 20 })).toEqual([])
  }, 30_000)

  it('takes no partial for a sideband because a much stronger one sits where its mirror would', () => {
    // A timpani's modes lie near 1 : 1.5 : 2 (common practice), so the ×2 mode sits where the ×1
    // would mirror it around the ×1.5; sidebands of a modulation are alike in level (Oppenheim & Willsky §8.1), these 20 dB apart.
    const modes = [
      { frequencyHz: 74, amplitudeDb: -10, decayDbPerS: 8 },
      { frequencyHz: 111, amplitudeDb: -14, decayDbPerS: 10 },
    ]
    const upper = { frequencyHz: 148, amplitudeDb: -32, decayDbPerS: 12 }
    const found = look([...modes, upper], modes.map(p => reported(p)))
    expect(found).toHaveLength(1)
    expect(Math.abs(centsBetween(found[0]!.frequencyHz, upper.frequencyHz))).toBeLessThan(0.5)
  }, 30_000)

  it('refuses a window outside the signal', () => {
    expect(() => findLongLookPartials(new Float64Array(1000), sampleRate, [], [], settings)).toThrow(RangeError)
  })
})
