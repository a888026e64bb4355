import { describe, expect, it } from 'vitest'
import { separateDoublet } from '../../../../shared/analysis/separateDoublet'
import { synthStrike, type SynthPartial } from '../../../../shared/synthesis/synthStrike'

const sampleRate = 44100

// Synthetic truths (our own scenarios). common practice: a bell's modes and a steel note's
// partials come as close doublets from slight asymmetry, and a bar's first twisting mode can
// sit a few hertz from a bending mode, weaker and dying faster.
const cases: { name: string, parts: SynthPartial[], durationS: number, centerHz: number, halfWidthHz: number }[] = [
  { name: 'bell doublet 0.8 Hz apart', parts: [{ frequencyHz: 880, amplitudeDb: -10, decayDbPerS: 3 }, { frequencyHz: 880.8, amplitudeDb: -12, decayDbPerS: 4 }], durationS: 3, centerHz: 880.4, halfWidthHz: 3 },
  { name: 'steel note doublet 2.5 Hz apart', parts: [{ frequencyHz: 587.3, amplitudeDb: -8, decayDbPerS: 8 }, { frequencyHz: 589.8, amplitudeDb: -11, decayDbPerS: 12 }], durationS: 1.2, centerHz: 588.5, halfWidthHz: 5 },
  { name: 'bar twisting mode 6 Hz above a bending mode, 20 dB weaker', parts: [{ frequencyHz: 440, amplitudeDb: -6, decayDbPerS: 10 }, { frequencyHz: 446, amplitudeDb: -26, decayDbPerS: 40 }], durationS: 1, centerHz: 443, halfWidthHz: 8 },
]

describe('separateDoublet', () => {
  it.each(cases)('separates the $name', ({ parts, durationS, centerHz, halfWidthHz }) => {
    for (const seed of [1, 2]) {
      const signal = synthStrike(parts, { sampleRate, durationS, noiseDb: -75, seed })
      const pair = separateDoublet(signal, sampleRate, centerHz, { startIndex: 0, endIndex: signal.length, halfWidthHz })!
      expect(pair).not.toBeNull()
      parts.forEach((truth, k) => {
        expect(Math.abs(pair[k]!.frequencyHz - truth.frequencyHz)).toBeLessThan(0.01)
        expect(Math.abs(pair[k]!.decayDbPerS - truth.decayDbPerS)).toBeLessThan(0.05 * truth.decayDbPerS)
        expect(Math.abs(20 * Math.log10(pair[k]!.amplitude) - truth.amplitudeDb)).toBeLessThan(0.1)
      })
    }
  }, 60_000)

  it('returns null for a single partial', () => {
    const signal = synthStrike([{ frequencyHz: 600, amplitudeDb: -6, decayDbPerS: 5 }], { sampleRate, durationS: 1, noiseDb: -90, seed: 3 })
    expect(separateDoublet(signal, sampleRate, 600, { startIndex: 0, endIndex: signal.length, halfWidthHz: 4 })).toBeNull()
  })
})
