import { describe, expect, it } from 'vitest'
import { roughPartialSpacing } from '../../../../shared/analysis/roughPartialSpacing'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 48000

describe('roughPartialSpacing', () => {
  // A marimba-like bar tuned 1 : 4 : 10 (common practice), with a weak ×4 and ×10.
  const x = synthStrike([
    { frequencyHz: 220, amplitudeDb: -6, decayDbPerS: 10 },
    { frequencyHz: 880, amplitudeDb: -26, decayDbPerS: 30 },
    { frequencyHz: 2200, amplitudeDb: -40, decayDbPerS: 60 },
  ], { sampleRate, durationS: 1, noiseDb: -90, seed: 3 })

  it('finds each partial to within a bin, with its level under the strongest', () => {
    const rough = roughPartialSpacing(x, sampleRate, 0, x.length)!
    // 0.3 s zero-padded to 32768 points: bins of 48000 / 32768 ≈ 1.46 Hz.
    const binHz = sampleRate / 32768
    expect(rough.frequenciesHz).toHaveLength(3)
    rough.frequenciesHz.forEach((f, i) => expect(Math.abs(f - [220, 880, 2200][i]!)).toBeLessThanOrEqual(binHz))
    // Level at the window's centre (0.15 s): −20 dB − (30 − 10) dB/s × 0.15 s = −23 dB; the peak bin
    // can miss the top of the lobe by up to about 1 dB (×2 zero padding, Harris 1978 scalloping).
    expect(rough.relativeDb[0]).toBe(0)
    expect(Math.abs(rough.relativeDb[1]! - (-20 - 3))).toBeLessThan(1.5)
    expect(rough.spacingHz).toBeCloseTo(660, -1)
    expect(rough.lowestHz).toBe(rough.frequenciesHz[0])
  })

  it('gives one peak an infinite spacing and no peak nothing', () => {
    const single = synthStrike([{ frequencyHz: 500, amplitudeDb: -10, decayDbPerS: 5 }], { sampleRate, durationS: 0.5, noiseDb: -90, seed: 4 })
    expect(roughPartialSpacing(single, sampleRate, 0, single.length)!.spacingHz).toBe(Infinity)
    expect(roughPartialSpacing(new Float64Array(20000), sampleRate, 0, 20000)).toBeNull()
    expect(roughPartialSpacing(single, sampleRate, 0, 63)).toBeNull()
  })
})
