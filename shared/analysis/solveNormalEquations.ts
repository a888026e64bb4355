import { Matrix, solve } from 'ml-matrix'

/**
 * Least-squares solution of A·x ≈ b through the normal equations AᵀA·x = Aᵀb, for a tall,
 * well-conditioned A with few columns (the sums are formed here from a row-major array,
 * so no tall matrix is allocated; the small square system is solved by ml-matrix's LU).
 * `a` holds rows × cols values row by row; `b` one column per right-hand side, row by row.
 */
export function solveNormalEquations(a: Float64Array, rows: number, cols: number, b: Float64Array, rhsCount = 1): Float64Array {
  if (a.length !== rows * cols || b.length !== rows * rhsCount) throw new RangeError('solveNormalEquations needs arrays of rows × cols and rows × rhsCount values')
  if (rows < cols) throw new RangeError('solveNormalEquations needs at least as many rows as columns')
  const ata = Array.from({ length: cols }, () => new Float64Array(cols))
  const atb = Array.from({ length: cols }, () => new Float64Array(rhsCount))
  for (let r = 0; r < rows; r++) {
    const base = r * cols
    for (let i = 0; i < cols; i++) {
      const ai = a[base + i]!
      if (ai === 0) continue
      const row = ata[i]!
      for (let j = i; j < cols; j++) row[j]! += ai * a[base + j]!
      const out = atb[i]!
      for (let k = 0; k < rhsCount; k++) out[k]! += ai * b[r * rhsCount + k]!
    }
  }
  for (let i = 0; i < cols; i++) for (let j = 0; j < i; j++) ata[i]![j] = ata[j]![i]!
  const x = solve(new Matrix(ata), new Matrix(atb))
  const out = new Float64Array(cols * rhsCount)
  for (let i = 0; i < cols; i++) for (let k = 0; k < rhsCount; k++) out[i * rhsCount + k] = x.get(i, k)
  return out
}
