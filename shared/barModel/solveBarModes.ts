import { CholeskyDecomposition, EigenvalueDecomposition, Matrix } from 'ml-matrix'
import { assembleBeam } from './assembleBeam'
import { checkBarGeometry } from './checkBarGeometry'
import type { BarGeometry, BarModes, BeamModelOptions } from './types'

/**
 * Bending modes of a free–free bar from its finite-element model: K v = ω² M v is turned
 * into a symmetric standard problem with the Cholesky factor of M (M = L Lᵀ,
 * A = L⁻¹ K L⁻ᵀ, v = L⁻ᵀ y; Golub & Van Loan, Matrix Computations, §8.7), solved by
 * ml-matrix, and the two rigid-body modes (ω = 0: translation and rotation) are dropped.
 */
export function solveBarModes(bar: BarGeometry, options: BeamModelOptions = {}): BarModes {
  checkBarGeometry(bar)
  const wanted = options.modes ?? 4
  const { stiffness, mass, nodesM } = assembleBeam(bar, options)
  const size = mass.rows
  if (!Number.isInteger(wanted) || wanted < 1 || wanted > size - 2) throw new RangeError('too many modes asked of this mesh')
  // Quadrature leaves the two triangles a rounding apart; the factorisation wants them equal.
  const cholesky = new CholeskyDecomposition(mass.add(mass.transpose()).mul(0.5))
  if (!cholesky.isPositiveDefinite()) throw new RangeError('the mass matrix is not positive definite')
  const lower = cholesky.lowerTriangularMatrix
  // A = L⁻¹ (L⁻¹ K)ᵀ, since K is symmetric.
  const a = forwardSolve(lower, forwardSolve(lower, stiffness).transpose())
  const symmetricA = a.add(a.transpose()).mul(0.5)
  const eigen = new EigenvalueDecomposition(symmetricA, { assumeSymmetric: true })
  const values = eigen.realEigenvalues
  const vectors = eigen.eigenvectorMatrix
  const order = values.map((_, i) => i).sort((i, j) => values[i]! - values[j]!)
  const frequenciesHz = new Float64Array(wanted)
  const shapes: Float64Array[] = []
  for (let m = 0; m < wanted; m++) {
    const index = order[m + 2]!
    frequenciesHz[m] = Math.sqrt(Math.max(values[index]!, 0)) / (2 * Math.PI)
    shapes.push(backSolveTransposed(lower, vectors.getColumn(index)))
  }
  return { frequenciesHz, nodesM, shapes }
}

/** X = L⁻¹ B for lower-triangular L, column by column (on plain arrays: element access through Matrix is slow). */
function forwardSolve(lower: Matrix, b: Matrix): Matrix {
  const n = lower.rows
  const l = lower.to2DArray()
  const rhs = b.to2DArray()
  const out = rhs.map(row => row.slice())
  for (let c = 0; c < b.columns; c++) {
    for (let i = 0; i < n; i++) {
      const li = l[i]!
      let s = rhs[i]![c]!
      for (let k = 0; k < i; k++) s -= li[k]! * out[k]![c]!
      out[i]![c] = s / li[i]!
    }
  }
  return new Matrix(out)
}

/** v = L⁻ᵀ y. */
function backSolveTransposed(lower: Matrix, y: number[]): Float64Array {
  const n = lower.rows
  const v = new Float64Array(n)
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i]!
    for (let k = i + 1; k < n; k++) s -= lower.get(k, i) * v[k]!
    v[i] = s / lower.get(i, i)
  }
  return v
}
