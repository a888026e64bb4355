import { Matrix } from 'ml-matrix'
import { describe, expect, it } from 'vitest'
import { nnls } from '../../../../shared/barModel/nnls'

describe('nnls', () => {
  it('solves the worked example of a general-purpose library', () => {
    // source: MATLAB lsqnonneg documentation example (C, d → x = [0; 0.6929]); from memory
    const c = new Matrix([[0.0372, 0.2869], [0.6861, 0.7071], [0.6233, 0.6245], [0.6344, 0.6170]])
    const x = nnls(c, Float64Array.of(0.8587, 0.1781, 0.0747, 0.8405))
    expect(x[0]).toBe(0)
    expect(x[1]).toBeCloseTo(0.6929, 4)
  })

  it('meets the Kuhn–Tucker conditions on a seeded random problem', () => {
    // source: Lawson & Hanson, Solving Least Squares Problems (1974), theorem 23.4: x ≥ 0, w = Aᵀ(b − Ax) ≤ 0, w_j = 0 where x_j > 0
    let seed = 7
    const random = () => ((seed = (seed * 16807) % 2147483647) / 2147483647) - 0.5
    const a = Matrix.from1DArray(8, 5, Array.from({ length: 40 }, random))
    const b = Float64Array.from({ length: 8 }, random)
    const x = nnls(a, b)
    const w = a.transpose().mmul(Matrix.columnVector(Array.from(b)).sub(a.mmul(Matrix.columnVector(Array.from(x))))).getColumn(0)
    x.forEach((v, j) => {
      expect(v).toBeGreaterThanOrEqual(0)
      expect(w[j]!).toBeLessThan(1e-9)
      if (v > 0) expect(Math.abs(w[j]!)).toBeLessThan(1e-9)
    })
    expect(x.some(v => v === 0) && x.some(v => v > 0)).toBe(true)
  })

  it('gives the unconstrained answer when it is already non-negative', () => {
    // source: least squares with an exact solution, x = [1, 2] (common practice)
    const x = nnls(new Matrix([[1, 0], [0, 1], [1, 1]]), Float64Array.of(1, 2, 3))
    expect(x[0]).toBeCloseTo(1, 12)
    expect(x[1]).toBeCloseTo(2, 12)
  })
})
