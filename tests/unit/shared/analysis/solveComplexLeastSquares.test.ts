import { Matrix, solve } from 'ml-matrix'
import { describe, expect, it } from 'vitest'
import { solveComplexLeastSquares } from '../../../../shared/analysis/solveComplexLeastSquares'
import { seededRandom } from '../../../support/seededRandom'

describe('solveComplexLeastSquares', () => {
  it('returns the exact solution of a consistent complex system', () => {
    // A = [[1, i], [1, −1], [i, 2]], x = [2 − i, 0.5 + 3i]: b = A·x has no residual.
    const a = { re: new Float64Array([1, 0, 1, -1, 0, 2]), im: new Float64Array([0, 1, 0, 0, 1, 0]) }
    const x = { re: [2, 0.5], im: [-1, 3] }
    const b = { re: new Float64Array(3), im: new Float64Array(3) }
    for (let r = 0; r < 3; r++) {
      for (let j = 0; j < 2; j++) {
        const ar = a.re[r * 2 + j]!
        const ai = a.im[r * 2 + j]!
        b.re[r]! += ar * x.re[j]! - ai * x.im[j]!
        b.im[r]! += ar * x.im[j]! + ai * x.re[j]!
      }
    }
    const got = solveComplexLeastSquares(a, 3, 2, b)
    // source: the chosen x (a consistent system's least-squares solution is its solution)
    for (let j = 0; j < 2; j++) {
      expect(got.re[j]).toBeCloseTo(x.re[j]!, 12)
      expect(got.im[j]).toBeCloseTo(x.im[j]!, 12)
    }
  })

  it('agrees with a general-purpose least-squares solver (ml-matrix QR of the real embedding) on a tall random system', () => {
    const random = seededRandom(11)
    const rows = 50
    const cols = 6
    const a = { re: Float64Array.from({ length: rows * cols }, () => random.normal()), im: Float64Array.from({ length: rows * cols }, () => random.normal()) }
    const b = { re: Float64Array.from({ length: rows }, () => random.normal()), im: Float64Array.from({ length: rows }, () => random.normal()) }
    const got = solveComplexLeastSquares(a, rows, cols, b)
    // source: min ‖Ax − b‖ over complex x is min over [Re x; Im x] of the real system [Re A −Im A; Im A Re A]
    // (any linear-algebra text), solved here by ml-matrix's QR least squares.
    const embedded = new Matrix(2 * rows, 2 * cols)
    for (let r = 0; r < rows; r++) {
      for (let j = 0; j < cols; j++) {
        embedded.set(r, j, a.re[r * cols + j]!)
        embedded.set(r, cols + j, -a.im[r * cols + j]!)
        embedded.set(rows + r, j, a.im[r * cols + j]!)
        embedded.set(rows + r, cols + j, a.re[r * cols + j]!)
      }
    }
    const reference = solve(embedded, Matrix.columnVector([...b.re, ...b.im]))
    for (let j = 0; j < cols; j++) {
      expect(got.re[j]).toBeCloseTo(reference.get(j, 0), 10)
      expect(got.im[j]).toBeCloseTo(reference.get(cols + j, 0), 10)
    }
  })

  it('hands a rank-deficient system to the real solve, which refuses it as singular, and refuses bad sizes', () => {
    // Two equal columns: AᴴA = [[3, 3], [3, 3]] is singular, not positive definite.
    const a = { re: new Float64Array([1, 1, 1, 1, 1, 1]), im: new Float64Array(6) }
    const b = { re: new Float64Array([1, 2, 3]), im: new Float64Array(3) }
    expect(() => solveComplexLeastSquares(a, 3, 2, b)).toThrow(/singular/)
    expect(() => solveComplexLeastSquares(a, 2, 3, { re: new Float64Array(2), im: new Float64Array(2) })).toThrow(RangeError)
    expect(() => solveComplexLeastSquares(a, 3, 2, { re: new Float64Array(2), im: new Float64Array(3) })).toThrow(RangeError)
  })
})
