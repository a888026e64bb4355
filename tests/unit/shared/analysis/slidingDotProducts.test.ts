import { describe, expect, it } from 'vitest'
import { slidingDotProducts } from '../../../../shared/analysis/slidingDotProducts'
import { seededRandom } from '../../../support/seededRandom'

/** out[m] = Σᵢ a[i]·b[i + m], term by term (the definition). */
function direct(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(b.length - a.length + 1)
  for (let m = 0; m < out.length; m++) for (let i = 0; i < a.length; i++) out[m]! += a[i]! * b[i + m]!
  return out
}

describe('slidingDotProducts', () => {
  it('equals the sums taken term by term, for lengths that are and are not powers of two', () => {
    const random = seededRandom(12)
    for (const [na, nb] of [[1, 1], [3, 10], [64, 64], [100, 181], [1000, 1401], [37, 1024]] as const) {
      const a = Float64Array.from({ length: na }, () => random.normal())
      const b = Float64Array.from({ length: nb }, () => random.normal())
      const fast = slidingDotProducts(a, b)
      const slow = direct(a, b)
      expect(fast).toHaveLength(nb - na + 1)
      // source: the definition; the FFT's rounding is ~ε·log₂N·Σ|a||b| (Oppenheim & Schafer §9.7).
      for (let m = 0; m < slow.length; m++) expect(fast[m]).toBeCloseTo(slow[m]!, 9)
    }
  })

  it('finds a copy of the short signal where it lies in the long one', () => {
    const random = seededRandom(3)
    const b = Float64Array.from({ length: 500 }, () => random.normal())
    const products = slidingDotProducts(b.slice(123, 223), b)
    let best = 0
    for (let m = 1; m < products.length; m++) if (products[m]! > products[best]!) best = m
    expect(best).toBe(123)
  })

  it('refuses an empty signal or one longer than the other', () => {
    expect(() => slidingDotProducts(new Float64Array(0), new Float64Array(4))).toThrow(RangeError)
    expect(() => slidingDotProducts(new Float64Array(5), new Float64Array(4))).toThrow(RangeError)
  })
})
