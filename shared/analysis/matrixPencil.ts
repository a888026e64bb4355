import { EigenvalueDecomposition, Matrix, solve } from 'ml-matrix'
import type { ComplexSignal } from './mixDownBand'
import { selectModelOrder } from './selectModelOrder'

/** Damped complex exponentials y[m] ≈ Σ_k c_k · z_kᵐ, z_k = e^{−δ_k + 2πi ν_k}, sorted by ν. */
export interface ExponentialFit {
  /** ν_k, in cycles per sample (within ±¼). */
  frequencyCycles: Float64Array
  /** δ_k, in nepers per sample (positive: decaying). */
  dampingNepers: Float64Array
  /** |c_k| at sample 0. */
  amplitude: Float64Array
  /** arg c_k at sample 0, in rad. */
  phaseRad: Float64Array
  /** Singular values of the data matrix, largest first. */
  singularValues: Float64Array
  /** √(mean |y − fit|²) over the samples. */
  residualRms: number
}

export interface PencilSettings {
  /** Number of exponentials; omitted: chosen by MDL (selectModelOrder). */
  order?: number
  /** Largest order MDL may choose (default 8). */
  maxOrder?: number
  /** Smallest order MDL may choose (default 1). */
  minOrder?: number
  /** Pencil parameter L as a fraction of the length (default ⅓). */
  pencilFraction?: number
}

/**
 * Matrix pencil method (Hua & Sarkar 1990, IEEE Trans. ASSP 38(5) 814–824, the SVD /
 * total-least-squares form): the Hankel matrix Y[i][j] = y[i + j] of size (N − L) × (L + 1)
 * is reduced to its K dominant right singular vectors V (eigenvectors of YᴴY); with W = conj(V), W₁ / W₂ (last /
 * first row dropped) span shifted copies of the signal subspace, and the eigenvalues of
 * W₁⁺W₂ are the poles z_k. Amplitudes c_k follow by least squares on the Vandermonde matrix.
 *
 * Complex algebra runs on ml-matrix through the real embedding φ(A) = [[Re A, −Im A],
 * [Im A, Re A]], which keeps products, inverses and singular values (each twice). Its
 * eigenvalues come in pairs z, z̄; multiplying by i first (in the subspace's own
 * coordinates) and keeping the upper half-plane picks the true z, valid for |ν| < ¼ —
 * mixDownBand keeps its passband there.
 */
export function matrixPencil(signal: ComplexSignal, settings: PencilSettings = {}): ExponentialFit {
  const n = signal.re.length
  if (signal.im.length !== n) throw new RangeError('matrixPencil needs real and imaginary parts of equal length')
  const maxOrder = settings.maxOrder ?? 8
  const fraction = settings.pencilFraction ?? 1 / 3
  if (!(fraction > 0 && fraction <= 0.5)) throw new RangeError('matrixPencil needs a pencil fraction in (0, ½]')
  const pencil = Math.max(2, Math.min(Math.floor((n - 1) / 2), Math.round(n * fraction)))
  const rows = n - pencil
  const cols = pencil + 1
  if (n < 6 || rows < cols) throw new RangeError('matrixPencil needs at least six samples')

  // Y^H·Y of the Hankel matrix (cols × cols, Hermitian), built by the shift recurrence
  // G[j+1][k+1] = G[j][k] − conj(y_j)·y_k + conj(y_{j+rows})·y_{k+rows}, then its real
  // embedding, whose eigenvalues are σ² (each twice) and eigenvectors [Re v; Im v].
  const { re, im } = signal
  const gram = new Matrix(2 * cols, 2 * cols)
  const put = (j: number, k: number, gr: number, gi: number) => {
    gram.data[j]![k] = gr
    gram.data[cols + j]![cols + k] = gr
    gram.data[cols + j]![k] = gi
    gram.data[j]![cols + k] = -gi
  }
  const gRe = new Float64Array(cols * cols)
  const gIm = new Float64Array(cols * cols)
  for (let k = 0; k < cols; k++) {
    let sr = 0
    let si = 0
    for (let i = 0; i < rows; i++) {
      sr += re[i]! * re[i + k]! + im[i]! * im[i + k]!
      si += re[i]! * im[i + k]! - im[i]! * re[i + k]!
    }
    gRe[k] = sr
    gIm[k] = si
  }
  for (let j = 1; j < cols; j++) {
    for (let k = j; k < cols; k++) {
      const a = j - 1
      const b = k - 1
      const c = a + rows
      const d = b + rows
      gRe[j * cols + k] = gRe[a * cols + b]! - (re[a]! * re[b]! + im[a]! * im[b]!) + (re[c]! * re[d]! + im[c]! * im[d]!)
      gIm[j * cols + k] = gIm[a * cols + b]! - (re[a]! * im[b]! - im[a]! * re[b]!) + (re[c]! * im[d]! - im[c]! * re[d]!)
    }
  }
  for (let j = 0; j < cols; j++) {
    for (let k = j; k < cols; k++) {
      put(j, k, gRe[j * cols + k]!, gIm[j * cols + k]!)
      put(k, j, gRe[j * cols + k]!, -gIm[j * cols + k]!)
    }
  }
  const eigen = new EigenvalueDecomposition(gram, { assumeSymmetric: true })
  const ascending = eigen.realEigenvalues
  const singularValues = new Float64Array(cols)
  for (let k = 0; k < cols; k++) singularValues[k] = Math.sqrt(Math.max(0, ascending[2 * cols - 1 - 2 * k]!))
  const order = settings.order ?? selectModelOrder(singularValues, rows, { maxOrder, minOrder: settings.minOrder })
  if (!(Number.isInteger(order) && order >= 1 && order < cols)) throw new RangeError('matrixPencil needs an order between 1 and the pencil parameter')

  // Signal subspace: 2K real vectors [Re w; Im w] with w = conj(v).
  const v = eigen.eigenvectorMatrix
  const basis = new Matrix(2 * cols, 2 * order)
  for (let r = 0; r < 2 * cols; r++) {
    const sign = r < cols ? 1 : -1
    for (let k = 0; k < 2 * order; k++) basis.data[r]![k] = sign * v.get(r, 2 * cols - 1 - k)
  }
  const drop = (skip: number) => {
    const rowsKept: number[] = []
    for (let r = 0; r < cols; r++) if (r !== skip) rowsKept.push(r)
    for (let r = 0; r < cols; r++) if (r !== skip) rowsKept.push(cols + r)
    return basis.selection(rowsKept, Array.from({ length: 2 * order }, (_, k) => k))
  }
  const shift = solve(drop(cols - 1), drop(0))
  // Multiplication by i in the subspace's coordinates: Bᵀ·J·B with J[a; b] = [−b; a].
  const times = new Matrix(2 * cols, 2 * order)
  for (let r = 0; r < cols; r++) {
    for (let k = 0; k < 2 * order; k++) {
      times.data[r]![k] = -basis.data[cols + r]![k]!
      times.data[cols + r]![k] = basis.data[r]![k]!
    }
  }
  const rotate = basis.transpose().mmul(times)
  const evd = new EigenvalueDecomposition(rotate.mmul(shift))
  const candidates = evd.realEigenvalues
    .map((re, k) => ({ re, im: evd.imaginaryEigenvalues[k]! }))
    .sort((a, b) => b.im - a.im)
    .slice(0, order)
  // z = λ / i.
  const poles = candidates.map(l => ({ re: l.im, im: -l.re }))
  return fitAmplitudes(signal, poles, singularValues)
}

/** Least-squares amplitudes for known poles (Vandermonde system in the real embedding). */
function fitAmplitudes(signal: ComplexSignal, poles: { re: number, im: number }[], singularValues: Float64Array): ExponentialFit {
  const n = signal.re.length
  const k = poles.length
  const vandermonde = new Matrix(2 * n, 2 * k)
  const rhs = new Matrix(2 * n, 1)
  for (let p = 0; p < k; p++) {
    let zr = 1
    let zi = 0
    const { re: pr, im: pi } = poles[p]!
    for (let m = 0; m < n; m++) {
      vandermonde.data[m]![p] = zr
      vandermonde.data[m]![k + p] = -zi
      vandermonde.data[n + m]![p] = zi
      vandermonde.data[n + m]![k + p] = zr
      const nr = zr * pr - zi * pi
      zi = zr * pi + zi * pr
      zr = nr
    }
  }
  for (let m = 0; m < n; m++) {
    rhs.data[m]![0] = signal.re[m]!
    rhs.data[n + m]![0] = signal.im[m]!
  }
  const c = solve(vandermonde, rhs)
  const fitted = vandermonde.mmul(c)
  let residual = 0
  for (let r = 0; r < 2 * n; r++) residual += (rhs.data[r]![0]! - fitted.data[r]![0]!) ** 2
  const order = poles.map((z, p) => ({ z, p, nu: Math.atan2(z.im, z.re) / (2 * Math.PI) })).sort((a, b) => a.nu - b.nu)
  const fit: ExponentialFit = {
    frequencyCycles: new Float64Array(k),
    dampingNepers: new Float64Array(k),
    amplitude: new Float64Array(k),
    phaseRad: new Float64Array(k),
    singularValues,
    residualRms: Math.sqrt(residual / n),
  }
  order.forEach(({ z, p, nu }, i) => {
    const cr = c.get(p, 0)
    const ci = c.get(k + p, 0)
    fit.frequencyCycles[i] = nu
    fit.dampingNepers[i] = -Math.log(Math.hypot(z.re, z.im))
    fit.amplitude[i] = Math.hypot(cr, ci)
    fit.phaseRad[i] = Math.atan2(ci, cr)
  })
  return fit
}
