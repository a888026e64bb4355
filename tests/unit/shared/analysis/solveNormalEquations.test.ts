import { Matrix, solve } from 'ml-matrix'
import { describe, expect, it } from 'vitest'
import { solveNormalEquations } from '../../../../shared/analysis/solveNormalEquations'
import { seededRandom } from '../../../support/seededRandom'

describe('solveNormalEquations', () => {
  it('fits a straight line exactly like the textbook least-squares formulas', () => {
    // y = 2 + 3x plus residuals that sum to zero and are orthogonal to x, so the fit is exact.
    const x = [0, 1, 2, 3, 4]
    const residual = [1, -2, 0, 2, -1]
    const a = new Float64Array(x.flatMap(v => [1, v]))
    const b = new Float64Array(x.map((v, i) => 2 + 3 * v + residual[i]!))
    const [intercept, slope] = solveNormalEquations(a, 5, 2, b)
    // source: the closed-form simple regression slope Σ(x−x̄)(y−ȳ)/Σ(x−x̄)² (any statistics text) — here 3 and 2
    expect(slope).toBeCloseTo(3, 12)
    expect(intercept).toBeCloseTo(2, 12)
  })

  it('solves several right-hand sides at once', () => {
    const a = new Float64Array([1, 0, 0, 1, 1, 1])
    const b = new Float64Array([1, 2, 3, 4, 4, 6])
    const x = solveNormalEquations(a, 3, 2, b, 2)
    expect(Array.from(x)).toEqual([expect.closeTo(1, 12), expect.closeTo(2, 12), expect.closeTo(3, 12), expect.closeTo(4, 12)])
  })

  it('refuses mismatched sizes or a wide system', () => {
    expect(() => solveNormalEquations(new Float64Array(5), 3, 2, new Float64Array(3))).toThrow(RangeError)
    expect(() => solveNormalEquations(new Float64Array(6), 2, 3, new Float64Array(2))).toThrow(RangeError)
  })

  it('agrees with a general-purpose least-squares solver (ml-matrix QR) on a tall random system', () => {
    const random = seededRandom(7)
    const rows = 60
    const cols = 8
    const a = Float64Array.from({ length: rows * cols }, () => random.normal())
    const b = Float64Array.from({ length: rows }, () => random.normal())
    const x = solveNormalEquations(a, rows, cols, b)
    // source: ml-matrix's solve of a non-square system is least squares by QR decomposition
    const reference = solve(new Matrix(Array.from({ length: rows }, (_, r) => Array.from(a.subarray(r * cols, (r + 1) * cols)))), Matrix.columnVector(Array.from(b)))
    for (let i = 0; i < cols; i++) expect(x[i]).toBeCloseTo(reference.get(i, 0), 10)
  })

  it('hands a rank-deficient system to the LU solve, which refuses it as singular', () => {
    // Two equal columns: AᵀA = [[3, 3], [3, 3]] is singular, not positive definite.
    const a = new Float64Array([1, 1, 1, 1, 1, 1])
    expect(() => solveNormalEquations(a, 3, 2, new Float64Array([1, 2, 3]))).toThrow(/singular/)
  })
})
