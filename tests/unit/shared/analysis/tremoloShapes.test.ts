import { describe, expect, it } from 'vitest'
import { analyzeSamples, centsBetween } from '../../../../shared/analysis/index'
import { synthRealisticStrike } from '../../../../shared/synthesis/synthRealisticStrike'

// A vibraphone C3 bar, 1 : 4 : 10 (source: Rossing, Science of Percussion Instruments, 2000, ch. 3),
// 130.81 Hz (source: ISO 16:1975, A4 = 440 Hz, equal temperament).
const F0 = 130.81
const MODES = [
  { frequencyHz: F0, amplitudeDb: -8, decayDbPerS: 2 },
  { frequencyHz: 4 * F0, amplitudeDb: -18, decayDbPerS: 6 },
  { frequencyHz: 10 * F0, amplitudeDb: -28, decayDbPerS: 25 },
]

/** The bar under a tremolo envelope that is no pure sine (discs that open and shut, common practice). */
function strikeWith(envelope: (phase: number) => number, rateHz: number): Float64Array {
  const sampleRate = 44100
  const x = synthRealisticStrike(MODES, { sampleRate, durationS: 4, onsetS: 0.1, seed: 3, noiseDb: -70 })
  return x.map((v, i) => v * envelope((2 * Math.PI * rateHz * i) / sampleRate))
}

// Envelopes with harmonics: a raised cosine squared (its second harmonic a quarter of the first)
// and a soft square (odd harmonics falling as 1/k). The modulation theorem puts a sideband pair
// at every harmonic k·f_m of the envelope; none of them is a mode of the bar.
const SHAPES: [string, (phase: number) => number, number][] = [
  ['raised cosine², depth 0.8, 2 Hz', p => 1 - 0.8 * ((1 - Math.cos(p)) / 2) ** 2, 2],
  ['raised cosine², depth 0.8, 4 Hz', p => 1 - 0.8 * ((1 - Math.cos(p)) / 2) ** 2, 4],
  ['soft square, depth 0.5, 4 Hz', p => 1 - 0.5 * (1 - Math.tanh(4 * Math.cos(p)) / Math.tanh(4)) / 2, 4],
]

describe('tremolo whose envelope is no pure sine', () => {
  for (const [name, envelope, rateHz] of SHAPES) {
    it(`${name}: the three modes alone, each where it is, with the rate`, () => {
      const result = analyzeSamples(strikeWith(envelope, rateHz), 44100, { targetHz: F0, ratios: [1, 4, 10] })
      expect(result.partials.map(p => Math.round(p.frequencyHz))).toEqual([131, 523, 1308])
      for (const [i, p] of result.partials.entries()) expect(Math.abs(centsBetween(MODES[i]!.frequencyHz, p.frequencyHz))).toBeLessThan(0.05)
      // The carrier's beat or modulation reading names the tremolo (or, for the slowest, its harmonic).
      const fundamental = result.partials[0]!
      const readHz = [fundamental.beatHz, fundamental.modulationHz].filter((v): v is number => v !== null)
      expect(readHz.some(hz => [rateHz, 2 * rateHz].some(r => Math.abs(hz - r) < 0.1 * r))).toBe(true)
    })
  }
})
