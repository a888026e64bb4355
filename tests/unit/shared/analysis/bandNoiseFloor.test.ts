import { describe, expect, it } from 'vitest'
import { bandNoiseFloor } from '../../../../shared/analysis/bandNoiseFloor'
import { seededRandom } from '../../../support/seededRandom'

/** Power bins of white Gaussian noise: exponentially distributed with mean `meanPower`. */
function whiteNoisePower(bins: number, meanPower: number, seed: number): Float64Array {
  const random = seededRandom(seed)
  return Float64Array.from({ length: bins }, () => -meanPower * Math.log(1 - random.uniform()))
}

describe('bandNoiseFloor', () => {
  it('is the lower quartile of white noise\'s power, −ln(3/4) of its mean', () => {
    const power = whiteNoisePower(8192, 2, 1)
    const floor = bandNoiseFloor(power, 64, 8000, 64)
    // source: |X|² of white Gaussian noise is exponential (χ² with 2 degrees of freedom); its quartile is −ln(0.75)·mean
    const quartile = -Math.log(0.75) * 2
    const bandLevels = [...new Set(floor.subarray(64, 8001))]
    expect(bandLevels.length).toBeGreaterThan(10)
    // Each band's quartile of ≤ 128 bins scatters by about 20 %; their mean by about 5 %.
    const mean = bandLevels.reduce((a, b) => a + b, 0) / bandLevels.length
    expect(Math.abs(mean / quartile - 1)).toBeLessThan(0.12)
    for (const level of bandLevels) expect(Math.abs(level / quartile - 1)).toBeLessThan(0.7)
  })

  it('follows a coloured floor band by band, half an octave at a time', () => {
    const power = whiteNoisePower(8192, 1, 2).map((p, k) => p * (k < 1000 ? 100 : 1))
    const floor = bandNoiseFloor(power, 32, 8000, 32)
    expect(floor[100]! / floor[6000]!).toBeGreaterThan(50)
    // Bands change at most at k·√2 (half an octave).
    let edges = 0
    for (let k = 33; k <= 8000; k++) if (floor[k] !== floor[k - 1]) edges++
    expect(edges).toBeLessThanOrEqual(Math.ceil(Math.log(8000 / 32) / Math.log(Math.SQRT2)))
    expect(floor[31]).toBe(0)
  })

  it('ignores partials covering under three quarters of a band', () => {
    const power = whiteNoisePower(4096, 1, 3)
    const clean = bandNoiseFloor(power, 1024, 4000, 64)
    const withPeaks = Float64Array.from(power)
    for (let k = 1100; k < 1400; k += 3) withPeaks[k] = 1e6
    const floor = bandNoiseFloor(withPeaks, 1024, 4000, 64)
    expect(floor[1200]! / clean[1200]!).toBeLessThan(2)
  })
})
