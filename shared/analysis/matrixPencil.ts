import { complexPowers } from './complexPowers'
import { hermitianEigen } from './hermitianEigen'
import { realEigenvalues } from './realEigenvalues'
import type { ComplexSignal } from './mixDownBand'
import { selectModelOrder } from './selectModelOrder'
import { solveComplexLeastSquares } from './solveComplexLeastSquares'
import { solveNormalEquations } from './solveNormalEquations'

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
 * YᴴY is decomposed as the complex Hermitian matrix it is (hermitianEigen); the rest of the
 * complex algebra runs through the real embedding φ(A) = [[Re A, −Im A],
 * [Im A, Re A]], which keeps products, inverses and singular values (each twice; eigenvalues by realEigenvalues). Its
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
  // L is also capped at 2·maxOrder + 8: enough room for the model, and the eigenproblem stays small.
  const pencil = Math.max(2, Math.min(Math.floor((n - 1) / 2), Math.round(n * fraction), 2 * Math.max(maxOrder, settings.order ?? 0) + 8))
  const rows = n - pencil
  const cols = pencil + 1
  if (n < 6 || rows < cols) throw new RangeError('matrixPencil needs at least six samples')

  // Y^H·Y of the Hankel matrix (cols × cols, Hermitian; its eigenvalues are σ²), upper
  // triangle built by the shift recurrence
  // G[j+1][k+1] = G[j][k] − conj(y_j)·y_k + conj(y_{j+rows})·y_{k+rows}.
  const { re, im } = signal
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
  // hermitianEigen reads the lower triangle: G[k][j] = conj(G[j][k]).
  for (let j = 0; j < cols; j++) {
    for (let k = j + 1; k < cols; k++) {
      gRe[k * cols + j] = gRe[j * cols + k]!
      gIm[k * cols + j] = -gIm[j * cols + k]!
    }
  }
  const eigen = hermitianEigen(gRe, gIm, cols)
  const singularValues = new Float64Array(cols)
  for (let k = 0; k < cols; k++) singularValues[k] = Math.sqrt(Math.max(0, eigen.values[cols - 1 - k]!))
  const order = settings.order ?? selectModelOrder(singularValues, rows, { maxOrder, minOrder: settings.minOrder })
  if (!(Number.isInteger(order) && order >= 1 && order < cols)) throw new RangeError('matrixPencil needs an order between 1 and the pencil parameter')

  // Signal subspace as 2K real vectors, row by row (2·cols × 2K): for each of the K dominant
  // eigenvectors v, w = conj(v) and i·w as [Re; Im] (the real span of the complex subspace).
  const width = 2 * order
  const basis = new Float64Array(2 * cols * width)
  for (let q = 0; q < order; q++) {
    const column = cols - 1 - q
    for (let r = 0; r < cols; r++) {
      const vr = eigen.vectorsRe[r * cols + column]!
      const vi = eigen.vectorsIm[r * cols + column]!
      basis[r * width + 2 * q] = vr
      basis[(cols + r) * width + 2 * q] = -vi
      basis[r * width + 2 * q + 1] = vi
      basis[(cols + r) * width + 2 * q + 1] = vr
    }
  }
  // W₁ (last row of each half dropped) and W₂ (first row dropped), then W₁⁺W₂ by least squares.
  const shifted = (skip: number) => {
    const out = new Float64Array(2 * (cols - 1) * width)
    let row = 0
    for (let r = 0; r < 2 * cols; r++) {
      if (r % cols === skip) continue
      out.set(basis.subarray(r * width, (r + 1) * width), row * width)
      row++
    }
    return out
  }
  const shift = solveNormalEquations(shifted(cols - 1), 2 * (cols - 1), width, shifted(0), width)
  // Multiplication by i in the subspace's coordinates: C = Bᵀ·J·B with J[a; b] = [−b; a],
  // C[i][j] = Σ_r bottom_i·top_j − top_i·bottom_j.
  const rotate = new Float64Array(width * width)
  for (let r = 0; r < cols; r++) {
    for (let i = 0; i < width; i++) {
      const top = basis[r * width + i]!
      const bottom = basis[(cols + r) * width + i]!
      for (let j = 0; j < width; j++) rotate[i * width + j]! += bottom * basis[r * width + j]! - top * basis[(cols + r) * width + j]!
    }
  }
  const product = new Float64Array(width * width)
  for (let i = 0; i < width; i++) {
    for (let j = 0; j < width; j++) {
      let sum = 0
      for (let k = 0; k < width; k++) sum += rotate[i * width + k]! * shift[k * width + j]!
      product[i * width + j] = sum
    }
  }
  // Our own QR iteration, with a limit on its sweeps (realEigenvalues): a library's without one never returned on one band.
  const eigenvalues = realEigenvalues(product, width)
  const candidates = Array.from(eigenvalues.re, (re, k) => ({ re, im: eigenvalues.im[k]! }))
    .sort((a, b) => b.im - a.im)
    .slice(0, order)
  // z = λ / i.
  const poles = candidates.map(l => ({ re: l.im, im: -l.re }))
  return fitAmplitudes(signal, poles, singularValues)
}

/** Least-squares amplitudes for known poles (the complex Vandermonde system). */
function fitAmplitudes(signal: ComplexSignal, poles: { re: number, im: number }[], singularValues: Float64Array): ExponentialFit {
  const n = signal.re.length
  const k = poles.length
  const vandermonde = { re: new Float64Array(n * k), im: new Float64Array(n * k) }
  const powers = { re: new Float64Array(n), im: new Float64Array(n) }
  for (let p = 0; p < k; p++) {
    const { re: zr, im: zi } = complexPowers(poles[p]!.re, poles[p]!.im, n, powers)
    for (let m = 0; m < n; m++) {
      vandermonde.re[m * k + p] = zr[m]!
      vandermonde.im[m * k + p] = zi[m]!
    }
  }
  const c = solveComplexLeastSquares(vandermonde, n, k, signal)
  let residual = 0
  for (let m = 0; m < n; m++) {
    let fitRe = 0
    let fitIm = 0
    for (let p = 0; p < k; p++) {
      const vr = vandermonde.re[m * k + p]!
      const vi = vandermonde.im[m * k + p]!
      fitRe += vr * c.re[p]! - vi * c.im[p]!
      fitIm += vr * c.im[p]! + vi * c.re[p]!
    }
    residual += (signal.re[m]! - fitRe) ** 2 + (signal.im[m]! - fitIm) ** 2
  }
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
    const cr = c.re[p]!
    const ci = c.im[p]!
    fit.frequencyCycles[i] = nu
    fit.dampingNepers[i] = -Math.log(Math.hypot(z.re, z.im))
    fit.amplitude[i] = Math.hypot(cr, ci)
    fit.phaseRad[i] = Math.atan2(ci, cr)
  })
  return fit
}
