import { describe, expect, it } from 'vitest'
import { directDft } from '../../../../shared/analysis/directDft'

describe('directDft', () => {
  it('turns a unit impulse into a flat spectrum and a constant into one bin', () => {
    // source: DFT definition, δ[n] ↦ 1 at every k; a constant c ↦ N·c at k = 0 and 0 elsewhere
    const n = 12
    const impulse = directDft(Array.from({ length: n }, (_, i) => (i === 0 ? 1 : 0)))
    for (let k = 0; k < n; k++) {
      expect(impulse[2 * k]).toBeCloseTo(1, 12)
      expect(impulse[2 * k + 1]).toBeCloseTo(0, 12)
    }
    const constant = directDft(new Array(n).fill(0.5))
    expect(constant[0]).toBeCloseTo(n * 0.5, 12)
    for (let k = 1; k < n; k++) expect(Math.hypot(constant[2 * k]!, constant[2 * k + 1]!)).toBeLessThan(1e-12)
  })

  it('puts a cosine at bin m into bins m and N − m with N·A/2 each', () => {
    // source: DFT of A·cos(2πmn/N + φ) is (N·A/2)e^{iφ} at k = m and its conjugate at k = N − m
    const n = 30
    const m = 7
    const amplitude = 0.8
    const phase = 0.4
    const x = Array.from({ length: n }, (_, i) => amplitude * Math.cos((2 * Math.PI * m * i) / n + phase))
    const X = directDft(x)
    expect(X[2 * m]).toBeCloseTo(((n * amplitude) / 2) * Math.cos(phase), 10)
    expect(X[2 * m + 1]).toBeCloseTo(((n * amplitude) / 2) * Math.sin(phase), 10)
    expect(X[2 * (n - m)]).toBeCloseTo(X[2 * m]!, 10)
    expect(X[2 * (n - m) + 1]).toBeCloseTo(-X[2 * m + 1]!, 10)
    for (let k = 0; k < n; k++) {
      if (k !== m && k !== n - m) expect(Math.hypot(X[2 * k]!, X[2 * k + 1]!)).toBeLessThan(1e-10)
    }
  })

  it('is linear and gives an empty spectrum for an empty signal', () => {
    const a = [1, -2, 3, 0.5, 4]
    const b = [0, 1, 1, -1, 2]
    const sum = directDft(a.map((v, i) => 2 * v + b[i]!))
    const A = directDft(a)
    const B = directDft(b)
    // source: linearity of the DFT (common practice)
    for (let k = 0; k < 10; k++) expect(sum[k]).toBeCloseTo(2 * A[k]! + B[k]!, 12)
    expect(directDft([]).length).toBe(0)
  })
})
