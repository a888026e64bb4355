import { describe, expect, it } from 'vitest'
import { fitLine } from '../../../../shared/analysis/fitLine'
import { seededRandom } from '../../../support/seededRandom'

describe('fitLine', () => {
  it('recovers an exact line, and weights change which points count', () => {
    const x = [0, 1, 2, 3, 4]
    const fit = fitLine(x, x.map(v => 5 - 2 * v))
    expect(fit.slope).toBeCloseTo(-2, 12)
    expect(fit.intercept).toBeCloseTo(5, 12)
    expect(fit.r2).toBeCloseTo(1, 12)
    for (const r of fit.residuals) expect(Math.abs(r)).toBeLessThan(1e-12)
    const y = [0, 1, 2, 3, 100]
    expect(fitLine(x, y, [1, 1, 1, 1, 0]).slope).toBeCloseTo(1, 12)
    expect(fitLine(x, y).slope).toBeGreaterThan(10)
  })

  it('r² follows its definition 1 − SS_res / SS_tot', () => {
    const x = [0, 1, 2, 3]
    const y = [0, 2, 1, 3]
    const fit = fitLine(x, y)
    // source: hand computation by the normal equations: slope 0.8, intercept 0.3, SS_res 1.8, SS_tot 5 → r² = 0.64
    expect(fit.slope).toBeCloseTo(0.8, 12)
    expect(fit.intercept).toBeCloseTo(0.3, 12)
    expect(fit.r2).toBeCloseTo(0.64, 12)
  })

  it('keeps its accuracy far from the origin (centred sums) and on seeded noise', () => {
    const random = seededRandom(8)
    const x = Array.from({ length: 200 }, (_, i) => 1e6 + i * 0.01)
    const y = x.map(v => -60 * (v - 1e6) + 3 + 0.1 * random.normal())
    const fit = fitLine(x, y)
    // source: least-squares slope standard error σ/√Σ(x − x̄)² = 0.1/√66.67 ≈ 0.012 here; 0.07 is about 6σ
    expect(fit.slope).toBeGreaterThan(-60.07)
    expect(fit.slope).toBeLessThan(-59.93)
    // source: least-squares residuals sum to zero with an intercept (normal equations)
    expect(Math.abs(fit.residuals.reduce((a, b) => a + b, 0))).toBeLessThan(1e-4)
  })

  it('refuses what has no line through it', () => {
    expect(() => fitLine([1, 1], [2, 3])).toThrow(RangeError)
    expect(() => fitLine([1], [2])).toThrow(RangeError)
    expect(() => fitLine([1, 2], [2, 3], [0, 0])).toThrow(RangeError)
    expect(() => fitLine([1, 2], [2, 3], [1])).toThrow(RangeError)
  })
})
