import type { ComplexSignal } from './mixDownBand'
import { solveNormalEquations } from './solveNormalEquations'

/**
 * Least-squares solution of A·x ≈ b for a tall, well-conditioned complex A (rows × cols, row by
 * row, its parts in `a.re` and `a.im`) through the normal equations AᴴA·x = Aᴴb, solved by a
 * complex Cholesky factorisation AᴴA = LLᴴ (Golub & Van Loan, Matrix Computations, 4th ed.,
 * §4.2): half the arithmetic of the same system in its real embedding [Re −Im; Im Re], which is
 * what every fit of damped exponentials solves. A system that is not positive definite (a
 * rank-deficient A) goes to that embedding's solve (solveNormalEquations), which decides as
 * before whether it can be solved, and throws where it cannot.
 */
export function solveComplexLeastSquares(a: ComplexSignal, rows: number, cols: number, b: ComplexSignal): ComplexSignal {
  if (a.re.length !== rows * cols || a.im.length !== rows * cols || b.re.length !== rows || b.im.length !== rows) {
    throw new RangeError('solveComplexLeastSquares needs rows × cols values for A and rows for b, in both parts')
  }
  if (rows < cols) throw new RangeError('solveComplexLeastSquares needs at least as many rows as columns')
  // AᴴA (upper triangle, then mirrored as its conjugate) and Aᴴb.
  const gRe = new Float64Array(cols * cols)
  const gIm = new Float64Array(cols * cols)
  const yRe = new Float64Array(cols)
  const yIm = new Float64Array(cols)
  for (let r = 0; r < rows; r++) {
    const base = r * cols
    const br = b.re[r]!
    const bi = b.im[r]!
    for (let i = 0; i < cols; i++) {
      const ar = a.re[base + i]!
      const ai = a.im[base + i]!
      const row = i * cols
      // conj(a_i)·a_j
      for (let j = i; j < cols; j++) {
        const cr = a.re[base + j]!
        const ci = a.im[base + j]!
        gRe[row + j]! += ar * cr + ai * ci
        gIm[row + j]! += ar * ci - ai * cr
      }
      yRe[i]! += ar * br + ai * bi
      yIm[i]! += ar * bi - ai * br
    }
  }
  for (let i = 0; i < cols; i++) {
    for (let j = 0; j < i; j++) {
      gRe[i * cols + j] = gRe[j * cols + i]!
      gIm[i * cols + j] = -gIm[j * cols + i]!
    }
  }
  return complexCholeskySolve(gRe, gIm, yRe, yIm, cols) ?? embeddedSolve(a, rows, cols, b)
}

/** Solve G·x = y for Hermitian positive definite G (n × n, row-major parts); null when G is not. */
function complexCholeskySolve(gRe: Float64Array, gIm: Float64Array, yRe: Float64Array, yIm: Float64Array, n: number): ComplexSignal | null {
  const lRe = new Float64Array(n * n)
  const lIm = new Float64Array(n * n)
  for (let j = 0; j < n; j++) {
    let d = gRe[j * n + j]!
    for (let k = 0; k < j; k++) d -= lRe[j * n + k]! ** 2 + lIm[j * n + k]! ** 2
    if (!(d > 0) || !Number.isFinite(d)) return null
    const pivot = Math.sqrt(d)
    lRe[j * n + j] = pivot
    for (let i = j + 1; i < n; i++) {
      // G[i][j] − Σ L[i][k]·conj(L[j][k])
      let sr = gRe[i * n + j]!
      let si = gIm[i * n + j]!
      for (let k = 0; k < j; k++) {
        const pr = lRe[i * n + k]!
        const pi = lIm[i * n + k]!
        const qr = lRe[j * n + k]!
        const qi = lIm[j * n + k]!
        sr -= pr * qr + pi * qi
        si -= pi * qr - pr * qi
      }
      lRe[i * n + j] = sr / pivot
      lIm[i * n + j] = si / pivot
    }
  }
  // L·z = y, then Lᴴ·x = z.
  const re = new Float64Array(n)
  const im = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    let sr = yRe[i]!
    let si = yIm[i]!
    for (let k = 0; k < i; k++) {
      const lr = lRe[i * n + k]!
      const li = lIm[i * n + k]!
      sr -= lr * re[k]! - li * im[k]!
      si -= lr * im[k]! + li * re[k]!
    }
    re[i] = sr / lRe[i * n + i]!
    im[i] = si / lRe[i * n + i]!
  }
  for (let i = n - 1; i >= 0; i--) {
    let sr = re[i]!
    let si = im[i]!
    for (let k = i + 1; k < n; k++) {
      // conj(L[k][i])·x_k
      const lr = lRe[k * n + i]!
      const li = lIm[k * n + i]!
      sr -= lr * re[k]! + li * im[k]!
      si -= lr * im[k]! - li * re[k]!
    }
    re[i] = sr / lRe[i * n + i]!
    im[i] = si / lRe[i * n + i]!
  }
  return { re, im }
}

/** The same system in its real embedding: rows [Re a | −Im a] over [Im a | Re a], unknowns [Re x; Im x]. */
function embeddedSolve(a: ComplexSignal, rows: number, cols: number, b: ComplexSignal): ComplexSignal {
  const width = 2 * cols
  const real = new Float64Array(2 * rows * width)
  for (let r = 0; r < rows; r++) {
    for (let j = 0; j < cols; j++) {
      const ar = a.re[r * cols + j]!
      const ai = a.im[r * cols + j]!
      real[r * width + j] = ar
      real[r * width + cols + j] = -ai
      real[(rows + r) * width + j] = ai
      real[(rows + r) * width + cols + j] = ar
    }
  }
  const rhs = new Float64Array(2 * rows)
  rhs.set(b.re)
  rhs.set(b.im, rows)
  const x = solveNormalEquations(real, 2 * rows, width, rhs)
  return { re: x.slice(0, cols), im: x.slice(cols) }
}
