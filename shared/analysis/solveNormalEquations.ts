import { Matrix, solve } from 'ml-matrix'

/**
 * Least-squares solution of A·x ≈ b through the normal equations AᵀA·x = Aᵀb, for a tall,
 * well-conditioned A with few columns (the sums are formed here from a row-major array,
 * so no tall matrix is allocated). The small symmetric system is solved by a Cholesky
 * factorisation AᵀA = LLᵀ (Golub & Van Loan, Matrix Computations, 4th ed., §4.2), in place:
 * it is called for every Gauss–Newton step of every partial, where building matrix objects
 * cost more than the arithmetic. A system that is not positive definite (rank-deficient A)
 * goes to ml-matrix's LU solve, which decides as before whether it can be solved.
 * `a` holds rows × cols values row by row; `b` one column per right-hand side, row by row.
 */
export function solveNormalEquations(a: Float64Array, rows: number, cols: number, b: Float64Array, rhsCount = 1): Float64Array {
  if (a.length !== rows * cols || b.length !== rows * rhsCount) throw new RangeError('solveNormalEquations needs arrays of rows × cols and rows × rhsCount values')
  if (rows < cols) throw new RangeError('solveNormalEquations needs at least as many rows as columns')
  // AᵀA (upper triangle, row-major cols × cols) and Aᵀb (cols × rhsCount).
  const ata = new Float64Array(cols * cols)
  const atb = new Float64Array(cols * rhsCount)
  for (let r = 0; r < rows; r++) {
    const base = r * cols
    for (let i = 0; i < cols; i++) {
      const ai = a[base + i]!
      if (ai === 0) continue
      const row = i * cols
      for (let j = i; j < cols; j++) ata[row + j]! += ai * a[base + j]!
      for (let k = 0; k < rhsCount; k++) atb[i * rhsCount + k]! += ai * b[r * rhsCount + k]!
    }
  }
  for (let i = 0; i < cols; i++) for (let j = 0; j < i; j++) ata[i * cols + j] = ata[j * cols + i]!
  return choleskySolve(ata, atb, cols, rhsCount) ?? luSolve(ata, atb, cols, rhsCount)
}

/** Solve S·x = y for symmetric positive definite S (n × n, row-major); null when S is not. */
function choleskySolve(s: Float64Array, y: Float64Array, n: number, rhsCount: number): Float64Array | null {
  const l = new Float64Array(n * n)
  for (let j = 0; j < n; j++) {
    let d = s[j * n + j]!
    for (let k = 0; k < j; k++) d -= l[j * n + k]! ** 2
    if (!(d > 0) || !Number.isFinite(d)) return null
    const pivot = Math.sqrt(d)
    l[j * n + j] = pivot
    for (let i = j + 1; i < n; i++) {
      let sum = s[i * n + j]!
      for (let k = 0; k < j; k++) sum -= l[i * n + k]! * l[j * n + k]!
      l[i * n + j] = sum / pivot
    }
  }
  const x = new Float64Array(n * rhsCount)
  for (let c = 0; c < rhsCount; c++) {
    // L·z = y, then Lᵀ·x = z.
    for (let i = 0; i < n; i++) {
      let sum = y[i * rhsCount + c]!
      for (let k = 0; k < i; k++) sum -= l[i * n + k]! * x[k * rhsCount + c]!
      x[i * rhsCount + c] = sum / l[i * n + i]!
    }
    for (let i = n - 1; i >= 0; i--) {
      let sum = x[i * rhsCount + c]!
      for (let k = i + 1; k < n; k++) sum -= l[k * n + i]! * x[k * rhsCount + c]!
      x[i * rhsCount + c] = sum / l[i * n + i]!
    }
  }
  return x
}

function luSolve(s: Float64Array, y: Float64Array, n: number, rhsCount: number): Float64Array {
  const rowsOf = (v: Float64Array, width: number) => Array.from({ length: n }, (_, i) => Array.from(v.subarray(i * width, (i + 1) * width)))
  const x = solve(new Matrix(rowsOf(s, n)), new Matrix(rowsOf(y, rhsCount)))
  const out = new Float64Array(n * rhsCount)
  for (let i = 0; i < n; i++) for (let k = 0; k < rhsCount; k++) out[i * rhsCount + k] = x.get(i, k)
  return out
}
