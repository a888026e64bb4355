import { describe, expect, it } from 'vitest'
import { analyzeSamples } from '../../../../shared/analysis/index'
import { splitDoublets } from '../../../../shared/analysis/splitDoublets'
import { synthStrike, type SynthPartial } from '../../../../shared/synthesis/synthStrike'
import { trackReading } from '../../../support/partials'

const sampleRate = 44100
const onsetS = 0.05

// Synthetic truths (our own scenarios). common practice: a bell's modes and a steel note's
// partials come as close doublets from slight asymmetry, and a bar's first twisting mode can
// sit a few hertz from a bending mode, weaker and dying faster.
const doublets: { name: string, parts: [SynthPartial, SynthPartial], durationS: number, targetHz: number }[] = [
  { name: 'bell pair 0.8 Hz apart over 3 s', parts: [{ frequencyHz: 880, amplitudeDb: -10, decayDbPerS: 3 }, { frequencyHz: 880.8, amplitudeDb: -12, decayDbPerS: 4 }], durationS: 3, targetHz: 880.6 },
  { name: 'steel-note pair 2.5 Hz apart over 1.2 s', parts: [{ frequencyHz: 587.3, amplitudeDb: -8, decayDbPerS: 8 }, { frequencyHz: 589.8, amplitudeDb: -11, decayDbPerS: 12 }], durationS: 1.2, targetHz: 587.33 },
  { name: 'twisting mode 6 Hz above a bending mode, 20 dB weaker', parts: [{ frequencyHz: 440, amplitudeDb: -6, decayDbPerS: 10 }, { frequencyHz: 446, amplitudeDb: -26, decayDbPerS: 40 }], durationS: 1, targetHz: 440 },
]

describe('doublets through the pipeline', () => {
  it.each(doublets)('reports the $name as two partials', ({ parts, durationS, targetHz }) => {
    const signal = synthStrike(parts, { sampleRate, durationS: durationS + onsetS, onsetS, noiseDb: -75, seed: 1 })
    const result = analyzeSamples(signal, sampleRate, { targetHz, ratios: [1] })
    for (const truth of parts) {
      const p = result.partials.filter(q => Math.abs(q.frequencyHz - truth.frequencyHz) < 0.4)
      expect(p, `${truth.frequencyHz} Hz`).toHaveLength(1)
      expect(Math.abs(p[0]!.frequencyHz - truth.frequencyHz)).toBeLessThan(0.05)
      expect(Math.abs(p[0]!.decayDbPerS / truth.decayDbPerS - 1)).toBeLessThan(0.05)
      // Amplitudes are referred to the onset the engine found (a doublet may start in a beat's trough).
      const atOnsetDb = truth.amplitudeDb - truth.decayDbPerS * (result.onsetS - onsetS)
      expect(Math.abs(p[0]!.amplitudeDb - atOnsetDb)).toBeLessThan(0.2)
      expect(p[0]!.beatHz).toBeCloseTo(Math.abs(parts[1].frequencyHz - parts[0].frequencyHz), 1)
      expect(p[0]!.uncertaintyCents).not.toBeNull()
      expect(p[0]!.crossCheckCents).toBeNull()
    }
    // Nothing else is reported near the pair.
    expect(result.partials.filter(q => Math.abs(q.frequencyHz - targetHz) < 10)).toHaveLength(2)
    // The template picks the stronger of the two (the bell's target lies nearer the weaker one).
    expect(result.matches![0]!.measuredHz).toBeCloseTo(parts[0].frequencyHz, 1)
  }, 30_000)

  it.each([
    { frequencyHz: 600, amplitudeDb: -6, decayDbPerS: 5 },
    { frequencyHz: 600, amplitudeDb: -6, decayDbPerS: 30 },
    { frequencyHz: 1500, amplitudeDb: -20, decayDbPerS: 60 },
    { frequencyHz: 220, amplitudeDb: -3, decayDbPerS: 2 },
  ])('does not split a single partial at $frequencyHz Hz decaying $decayDbPerS dB/s', (part) => {
    for (const seed of [1, 2, 3]) {
      const signal = synthStrike([part], { sampleRate, durationS: 2, onsetS, noiseDb: -70, seed })
      const near = analyzeSamples(signal, sampleRate).partials.filter(q => Math.abs(q.frequencyHz - part.frequencyHz) < 20)
      expect(near, `seed ${seed}`).toHaveLength(1)
      expect(near[0]!.crossCheckCents).not.toBeNull()
    }
  }, 30_000)
})

describe('splitDoublets', () => {
  it('splits no pair on the course of a pitch glide', () => {
    // The bell pair 0.8 Hz apart above, as the FFT path gives it (one reading inside one main lobe).
    const [a, b] = doublets[0]!.parts
    const signal = synthStrike([a, b], { sampleRate, durationS: 3 + onsetS, onsetS, noiseDb: -75, seed: 1 })
    const { refineSpanS: _span, strongestFrameDb: _frame, ...reading } = trackReading({ frequencyHz: 880.35, amplitudeDb: -8.5, decayDbPerS: 3.4, snrDb: 60, windowS: 0.5 })
    const onsetIndex = Math.round(onsetS * sampleRate)
    const settings = { startIndex: onsetIndex + 220, endIndex: signal.length, onsetIndex, peakDb: 0, peakMarginDb: 1, minAmplitudeDb: -80 }
    expect(splitDoublets(signal, sampleRate, [reading], settings).pairs).toHaveLength(2)
    // Had the strike's loudest sound glided from 900 Hz down to 870 Hz, a pair there is that glide read as two components.
    const glide = { fromHz: 900, toHz: 870, highestHz: 900, lowestHz: 870, startS: 0.06, endS: 0.8 }
    const onGlide = splitDoublets(signal, sampleRate, [reading], { ...settings, glide })
    expect(onGlide.pairs).toEqual([])
    expect(onGlide.single).toEqual([reading])
  }, 30_000)

  it('splits a pair whose short-window reading decays between its two components', () => {
    // Our own scenario after steel drum B4's ×2 (the sweep's freepats note): 982 Hz at 56 dB/s
    // under 989.75 Hz at 166 dB/s, 13 dB stronger. A 0.077 s band's frames follow their sum and read
    // one partial at 96.5 dB/s: neither component's decay within 60 % (the stronger one holds most energy).
    const parts: [SynthPartial, SynthPartial] = [{ frequencyHz: 982, amplitudeDb: -29, decayDbPerS: 56 }, { frequencyHz: 989.75, amplitudeDb: -16, decayDbPerS: 166 }]
    const signal = synthStrike(parts, { sampleRate, durationS: 0.8 + onsetS, onsetS, noiseDb: -75, seed: 2 })
    const { refineSpanS: _span, strongestFrameDb: _frame, ...reading } = trackReading({ frequencyHz: 989.5, amplitudeDb: -16, decayDbPerS: 96.5, snrDb: 58, windowS: 0.077 })
    const onsetIndex = Math.round(onsetS * sampleRate)
    const settings = { startIndex: onsetIndex + 220, endIndex: signal.length, onsetIndex, peakDb: 0, peakMarginDb: 1, minAmplitudeDb: -80 }
    const { pairs, single } = splitDoublets(signal, sampleRate, [reading], settings)
    expect(single).toEqual([])
    expect(pairs).toHaveLength(2)
    parts.forEach((truth, k) => {
      expect(Math.abs(pairs[k]!.frequencyHz - truth.frequencyHz)).toBeLessThan(0.05)
      expect(Math.abs(pairs[k]!.decayDbPerS / truth.decayDbPerS - 1)).toBeLessThan(0.05)
      expect(pairs[k]!.beatHz).toBeCloseTo(7.75, 1)
    })
  }, 30_000)

  it('splits off no attack transient whose decay brackets the reading', () => {
    // A partial at 600 Hz (20 dB/s) and a knock 6 Hz above it dying at 400 dB/s: the reading's
    // 25 dB/s lies between them, but the knock falls 67 dB within one beat.
    const parts: SynthPartial[] = [{ frequencyHz: 600, amplitudeDb: -10, decayDbPerS: 20 }, { frequencyHz: 606, amplitudeDb: -8, decayDbPerS: 400 }]
    const signal = synthStrike(parts, { sampleRate, durationS: 1.5 + onsetS, onsetS, noiseDb: -75, seed: 3 })
    const { refineSpanS: _span, strongestFrameDb: _frame, ...reading } = trackReading({ frequencyHz: 600.2, amplitudeDb: -10, decayDbPerS: 25, snrDb: 60, windowS: 0.1 })
    const onsetIndex = Math.round(onsetS * sampleRate)
    const settings = { startIndex: onsetIndex + 220, endIndex: signal.length, onsetIndex, peakDb: 0, peakMarginDb: 1, minAmplitudeDb: -80 }
    expect(splitDoublets(signal, sampleRate, [reading], settings).pairs).toEqual([])
  }, 30_000)
})
