import { Matrix, QrDecomposition } from 'ml-matrix'

/**
 * Non-negative least squares: x ≥ 0 minimising ‖A x − b‖₂, by the active-set method of
 * Lawson & Hanson (Solving Least Squares Problems, 1974, ch. 23, algorithm NNLS).
 */
export function nnls(matrix: Matrix, target: Float64Array, options: { tolerance?: number, maxIterations?: number } = {}): Float64Array {
  const m = matrix.rows
  const n = matrix.columns
  if (target.length !== m) throw new RangeError('the target needs one value per row of the matrix')
  if (n === 0) return new Float64Array(0)
  const tolerance = options.tolerance ?? 1e-10 * Math.max(1, matrix.norm('frobenius'))
  const maxIterations = options.maxIterations ?? 3 * n + 10
  const b = Matrix.columnVector(Array.from(target))
  const x = new Float64Array(n)
  const passive = new Set<number>()
  for (let outer = 0; outer < maxIterations; outer++) {
    const gradient = matrix.transpose().mmul(b.clone().sub(matrix.mmul(Matrix.columnVector(Array.from(x))))).getColumn(0)
    let best = -1
    for (let j = 0; j < n; j++) {
      if (!passive.has(j) && gradient[j]! > tolerance && (best < 0 || gradient[j]! > gradient[best]!)) best = j
    }
    if (best < 0) break
    passive.add(best)
    for (let inner = 0; inner <= n; inner++) {
      const z = solvePassive(matrix, b, passive, n)
      const blocked = [...passive].filter(j => z[j]! <= 0)
      if (blocked.length === 0) {
        x.set(z)
        break
      }
      // Step from x towards z as far as every passive variable stays non-negative.
      let alpha = 1
      for (const j of blocked) alpha = Math.min(alpha, x[j]! / (x[j]! - z[j]!))
      for (let j = 0; j < n; j++) x[j]! += alpha * (z[j]! - x[j]!)
      for (const j of [...passive]) {
        if (x[j]! <= tolerance) {
          passive.delete(j)
          x[j] = 0
        }
      }
      if (passive.size === 0) break
    }
  }
  return x
}

/** Least-squares solution on the passive columns only, zero elsewhere. */
function solvePassive(matrix: Matrix, b: Matrix, passive: Set<number>, n: number): Float64Array {
  const columns = [...passive].sort((a, c) => a - c)
  const sub = matrix.subMatrixColumn(columns)
  const solution = new QrDecomposition(sub).solve(b).getColumn(0)
  const z = new Float64Array(n)
  columns.forEach((j, i) => {
    z[j] = solution[i]!
  })
  return z
}
