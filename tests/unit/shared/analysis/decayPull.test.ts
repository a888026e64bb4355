import { describe, expect, it } from 'vitest'
import { decayPullDbPerS } from '../../../../shared/analysis/decayPull'

describe('decayPullDbPerS', () => {
  it('is nothing when the two decay readings differ by no more than their noise and the curve is straight', () => {
    expect(decayPullDbPerS(0.4, 0.5)).toBe(0)
    expect(decayPullDbPerS(-0.5, 0.5, 0)).toBe(0)
  })

  it('takes the spread beyond the noise as Δ/√2 and the bend as a rectangular half-width, in quadrature', () => {
    // source: JCGM 100:2008 (GUM) §5.1.2 (independent terms in quadrature) and §4.3.7 (u = a/√3);
    // √(5² − 3²) = 4 (arithmetic), so √(4²/2 + 3²/3) = √11.
    expect(decayPullDbPerS(5, 3, 3)).toBeCloseTo(Math.sqrt(11), 12)
    expect(decayPullDbPerS(-5, 3, -3)).toBeCloseTo(Math.sqrt(11), 12)
    expect(decayPullDbPerS(5, 0)).toBeCloseTo(5 / Math.SQRT2, 12)
  })

  it('refuses a negative noise level, and leaves the pull unknown where the noise is', () => {
    expect(() => decayPullDbPerS(1, -1)).toThrow(RangeError)
    expect(decayPullDbPerS(1, Number.NaN)).toBeNaN()
  })
})
