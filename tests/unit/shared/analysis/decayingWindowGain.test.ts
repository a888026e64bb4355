import { describe, expect, it } from 'vitest'
import { BLACKMAN_HARRIS_COEFFICIENTS, blackmanHarris } from '../../../../shared/analysis/blackmanHarris'
import { decayingWindowGain } from '../../../../shared/analysis/decayingWindowGain'

/** The gain by its definition, Σ w[n]·e^{−α(n + offset)}, summed sample by sample. */
function directGain(length: number, alphaPerSample: number, offset: number): number {
  const w = blackmanHarris(length)
  let sum = 0
  for (let n = 0; n < length; n++) sum += w[n]! * Math.exp(-alphaPerSample * (n + offset))
  return sum
}

describe('decayingWindowGain', () => {
  it('equals the direct sum over the window for decaying partials', () => {
    // source: definition Σ_{n<N} w[n] e^{−α(n + offset)} (Harris 1978 window), summed directly
    for (const [length, alpha, offset] of [[1024, 1e-3, 0], [4801, 2e-4, 300], [333, 0.05, -10], [96000, 1e-5, 48000]] as const) {
      expect(decayingWindowGain(length, alpha, offset) / directGain(length, alpha, offset)).toBeCloseTo(1, 9)
    }
  })

  it('is the window sum a0·N for a steady partial', () => {
    // source: Harris (1978), coherent gain of the periodic window Σw/N = a0 = 0.35875
    expect(decayingWindowGain(4096, 0, 0)).toBeCloseTo(4096 * BLACKMAN_HARRIS_COEFFICIENTS[0], 9)
    expect(decayingWindowGain(4096, 0, 0)).toBeCloseTo(4096 * 0.35875, 6)
  })

  it('scales by e^{−α·offset} when the reference moves', () => {
    // source: e^{−α(n + o)} = e^{−αo}·e^{−αn} (algebra)
    const alpha = 3e-4
    expect(decayingWindowGain(2000, alpha, 500) / decayingWindowGain(2000, alpha, 0)).toBeCloseTo(Math.exp(-alpha * 500), 12)
  })

  it('refuses an empty window', () => {
    expect(() => decayingWindowGain(0, 1e-3, 0)).toThrow(RangeError)
  })
})
