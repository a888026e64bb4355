import type { Matrix } from 'ml-matrix'
import { nnls } from './nnls'

/**
 * x with 0 ≤ x ≤ upper minimising ‖A x − b‖₂, by repeated NNLS (Lawson & Hanson 1974):
 * a variable that overshoots its bound is fixed at the bound, its column moved to the
 * right-hand side, and the rest solved again. Exact when at most the overshooting
 * variables end at their bounds, which is the usual case for cut depths.
 */
export function boundedLeastSquares(matrix: Matrix, target: Float64Array, upper: Float64Array): Float64Array {
  const n = matrix.columns
  if (upper.length !== n) throw new RangeError('one upper bound per column is needed')
  const x = new Float64Array(n)
  const fixed = new Set<number>()
  for (let j = 0; j < n; j++) if (!(upper[j]! > 0)) fixed.add(j)
  for (let round = 0; round <= n; round++) {
    const free = [...Array(n).keys()].filter(j => !fixed.has(j))
    if (free.length === 0) break
    const rhs = Float64Array.from(target, (b, i) => {
      let v = b
      for (const j of fixed) v -= matrix.get(i, j) * x[j]!
      return v
    })
    const solution = nnls(matrix.subMatrixColumn(free), rhs)
    let over = false
    free.forEach((j, k) => {
      x[j] = solution[k]!
      if (solution[k]! > upper[j]!) {
        x[j] = upper[j]!
        fixed.add(j)
        over = true
      }
    })
    if (!over) break
  }
  return x
}
