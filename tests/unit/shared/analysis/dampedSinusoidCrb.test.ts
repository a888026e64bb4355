import { describe, expect, it } from 'vitest'
import { dampedSinusoidCrb } from '../../../../shared/analysis/dampedSinusoidCrb'

/** Inverse of the Fisher matrix of x[n] = A e^{−δn} cos(ωn + φ) in white noise σ², by numerical derivatives. */
function numericBound(a: number, sigma: number, delta: number, omega: number, n: number): { omega: number, delta: number } {
  const model = (p: number[], i: number) => p[0]! * Math.exp(-p[2]! * i) * Math.cos(p[1]! * i + p[3]!)
  const p0 = [a, omega, delta, 0.4]
  const steps = [1e-6, 1e-9, 1e-9, 1e-6]
  const fisher = Array.from({ length: 4 }, () => new Float64Array(4))
  const grad = new Float64Array(4)
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < 4; k++) {
      const up = [...p0]
      const down = [...p0]
      up[k]! += steps[k]!
      down[k]! -= steps[k]!
      grad[k] = (model(up, i) - model(down, i)) / (2 * steps[k]!)
    }
    for (let r = 0; r < 4; r++) for (let c = 0; c < 4; c++) fisher[r]![c]! += (grad[r]! * grad[c]!) / (sigma * sigma)
  }
  // Invert the 4 × 4 matrix by Gauss–Jordan elimination.
  const m = fisher.map((row, r) => [...row, ...Array.from({ length: 4 }, (_, c) => (r === c ? 1 : 0))])
  for (let c = 0; c < 4; c++) {
    let pivot = c
    for (let r = c + 1; r < 4; r++) if (Math.abs(m[r]![c]!) > Math.abs(m[pivot]![c]!)) pivot = r;
    [m[c], m[pivot]] = [m[pivot]!, m[c]!]
    const d = m[c]![c]!
    for (let k = 0; k < 8; k++) m[c]![k]! /= d
    for (let r = 0; r < 4; r++) {
      if (r === c) continue
      const f = m[r]![c]!
      for (let k = 0; k < 8; k++) m[r]![k]! -= f * m[c]![k]!
    }
  }
  return { omega: Math.sqrt(m[1]![5]!), delta: Math.sqrt(m[2]![6]!) }
}

describe('dampedSinusoidCrb', () => {
  it('is Rife & Boorstyn\'s bound for an undamped sinusoid', () => {
    for (const n of [100, 1000, 44100]) {
      const a = 0.5
      const sigma = 0.01
      // source: Rife & Boorstyn (1974) IEEE Trans. IT 20(5); Kay (1993) Fundamentals of SSP I, Example 3.14: var(ω̂) ≥ 24σ² / (A² N (N² − 1))
      const expected = Math.sqrt((24 * sigma * sigma) / (a * a * n * (n * n - 1)))
      const bound = dampedSinusoidCrb(a, sigma, 0, n)
      expect(bound.frequencySdRad / expected).toBeCloseTo(1, 9)
      expect(bound.dampingSdNepers).toBe(bound.frequencySdRad)
    }
  })

  it('equals the inverse Fisher information of the damped model, computed numerically', () => {
    for (const [delta, n] of [[0.002, 1000], [0.01, 600], [0.0005, 3000]] as const) {
      const exact = numericBound(0.7, 0.02, delta, 0.9, n)
      const bound = dampedSinusoidCrb(0.7, 0.02, delta, n)
      // The closed form averages cos² to ½ (Yao & Pandit 1995); at ω = 0.9 rad that leaves < 2 % difference.
      expect(bound.frequencySdRad / exact.omega).toBeGreaterThan(0.98)
      expect(bound.frequencySdRad / exact.omega).toBeLessThan(1.02)
      expect(bound.dampingSdNepers / exact.delta).toBeGreaterThan(0.98)
      expect(bound.dampingSdNepers / exact.delta).toBeLessThan(1.02)
    }
  })

  it('grows with damping (less of the record carries the sinusoid) and scales with σ / A', () => {
    const base = dampedSinusoidCrb(1, 0.01, 0.001, 2000).frequencySdRad
    expect(dampedSinusoidCrb(1, 0.01, 0.004, 2000).frequencySdRad).toBeGreaterThan(base)
    expect(dampedSinusoidCrb(1, 0.02, 0.001, 2000).frequencySdRad).toBeCloseTo(2 * base, 12)
    expect(dampedSinusoidCrb(0.5, 0.01, 0.001, 2000).frequencySdRad).toBeCloseTo(2 * base, 12)
  })

  it('refuses a bad amplitude, noise or length', () => {
    expect(() => dampedSinusoidCrb(0, 0.1, 0, 10)).toThrow(RangeError)
    expect(() => dampedSinusoidCrb(1, -1, 0, 10)).toThrow(RangeError)
    expect(() => dampedSinusoidCrb(1, 0.1, 0, 2)).toThrow(RangeError)
  })
})
