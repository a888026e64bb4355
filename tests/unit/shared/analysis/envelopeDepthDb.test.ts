import { describe, expect, it } from 'vitest'
import { envelopeDepthDb } from '../../../../shared/analysis/envelopeDepthDb'
import { seededRandom } from '../../../support/seededRandom'

/** Times of `n` evenly spaced frames `hopS` apart, and a residual ±depth/2 at `rateHz`. */
function tremolo(n: number, hopS: number, rateHz: number, depthDb: number, phaseRad = 0.3) {
  const times = Float64Array.from({ length: n }, (_, i) => 0.05 + i * hopS)
  const residuals = times.map(t => (depthDb / 2) * Math.sin(2 * Math.PI * rateHz * (t - 0.05) + phaseRad))
  return { times, residuals }
}

describe('envelopeDepthDb', () => {
  it('gives the peak-to-trough depth of a sinusoidal residual over whole cycles', () => {
    // 5 Hz over 200 frames 10 ms apart = 10 whole cycles.
    const { times, residuals } = tremolo(200, 0.01, 5, 3)
    // source: a sinusoid of amplitude A swings 2A peak to trough; the DFT bin of a whole number of cycles is nA/2
    expect(envelopeDepthDb(times, residuals, 5)).toBeCloseTo(3, 9)
  })

  it('does not see a modulation at another whole-cycle rate', () => {
    const { times, residuals } = tremolo(200, 0.01, 5, 3)
    // source: orthogonality of DFT bins over whole cycles (common practice)
    expect(envelopeDepthDb(times, residuals, 8)).toBeLessThan(1e-9)
  })

  it('reads a depth through seeded noise to within its spread', () => {
    const random = seededRandom(12)
    const { times, residuals } = tremolo(400, 0.01, 4, 2)
    const noisy = residuals.map(r => r + 0.2 * random.normal())
    // source: the bin's noise is σ·√(2/n)·2 ≈ 0.028 dB here (common practice: allow about 4σ)
    expect(Math.abs(envelopeDepthDb(times, noisy, 4) - 2)).toBeLessThan(0.12)
  })

  it('refuses mismatched or empty input', () => {
    expect(() => envelopeDepthDb([], [], 5)).toThrow(RangeError)
    expect(() => envelopeDepthDb([0, 1], [0], 5)).toThrow(RangeError)
  })
})
