import { complexPowers } from './complexPowers'
import type { ExponentialFit } from './matrixPencil'
import type { ComplexSignal } from './mixDownBand'
import { solveComplexLeastSquares } from './solveComplexLeastSquares'

export interface RefineSettings {
  /** Most Gauss–Newton steps (default 4). */
  iterations?: number
}

/**
 * Least-squares refinement of damped exponentials y[m] ≈ Σ c_k·e^{p_k m},
 * p_k = −δ_k + 2πiν_k, started from the matrix pencil's estimate: Gauss–Newton steps on
 * all c_k and p_k together (the model is complex-analytic, so each step is one complex
 * least-squares solve with the Jacobian [e^{p_k m} | c_k·m·e^{p_k m}], by
 * solveComplexLeastSquares), halving a step that does not lower the residual. In white Gaussian noise the
 * least-squares fit is the maximum-likelihood estimate, which reaches the Cramér–Rao bound
 * at high SNR (Kay, Fundamentals of Statistical Signal Processing I, 1993, §7.5); the
 * pencil alone does not for the damping (Hua & Sarkar 1990, §V).
 */
export function refineExponentials(signal: ComplexSignal, start: ExponentialFit, settings: RefineSettings = {}): ExponentialFit {
  const n = signal.re.length
  const k = start.frequencyCycles.length
  if (signal.im.length !== n) throw new RangeError('refineExponentials needs real and imaginary parts of equal length')
  if (k === 0 || n < 2 * k + 1) return start
  const iterations = settings.iterations ?? 4
  const params = {
    cRe: Float64Array.from(start.amplitude, (a, i) => a * Math.cos(start.phaseRad[i]!)),
    cIm: Float64Array.from(start.amplitude, (a, i) => a * Math.sin(start.phaseRad[i]!)),
    pRe: Float64Array.from(start.dampingNepers, d => -d),
    pIm: Float64Array.from(start.frequencyCycles, nu => 2 * Math.PI * nu),
  }
  // Buffers reused across iterations and step halvings: the powers e^{p m}, two residuals
  // (the current one, which is the right-hand side, and a trial) and the Jacobian.
  const powers: ComplexSignal = { re: new Float64Array(n), im: new Float64Array(n) }
  let current = residual(signal, params, powers, { re: new Float64Array(n), im: new Float64Array(n), sumSq: 0 })
  let spare: Residual = { re: new Float64Array(n), im: new Float64Array(n), sumSq: 0 }
  // Columns Δc_k, then Δp_k, of the complex Jacobian, row by row; the right-hand side is the residual.
  const cols = 2 * k
  const jacobian = { re: new Float64Array(n * cols), im: new Float64Array(n * cols) }
  for (let it = 0; it < iterations; it++) {
    for (let q = 0; q < k; q++) {
      const cr = params.cRe[q]!
      const ci = params.cIm[q]!
      const stepMag = Math.exp(params.pRe[q]!)
      const { re: eRe, im: eIm } = complexPowers(stepMag * Math.cos(params.pIm[q]!), stepMag * Math.sin(params.pIm[q]!), n, powers)
      for (let m = 0; m < n; m++) {
        const er = eRe[m]!
        const ei = eIm[m]!
        jacobian.re[m * cols + q] = er
        jacobian.im[m * cols + q] = ei
        jacobian.re[m * cols + k + q] = m * (cr * er - ci * ei)
        jacobian.im[m * cols + k + q] = m * (cr * ei + ci * er)
      }
    }
    let step: ComplexSignal
    try {
      step = solveComplexLeastSquares(jacobian, n, cols, current)
    }
    catch {
      break
    }
    let scale = 1
    let accepted = false
    for (let tries = 0; tries < 6 && !accepted; tries++, scale /= 2) {
      const trial = {
        cRe: params.cRe.map((v, q) => v + scale * step.re[q]!),
        cIm: params.cIm.map((v, q) => v + scale * step.im[q]!),
        pRe: params.pRe.map((v, q) => v + scale * step.re[k + q]!),
        pIm: params.pIm.map((v, q) => v + scale * step.im[k + q]!),
      }
      const next = residual(signal, trial, powers, spare)
      if (next.sumSq < current.sumSq) {
        Object.assign(params, trial)
        const gain = (current.sumSq - next.sumSq) / current.sumSq
        spare = current
        current = next
        accepted = true
        if (gain < 1e-10) it = iterations
      }
    }
    if (!accepted) break
  }
  const order = Array.from({ length: k }, (_, q) => q).sort((a, b) => params.pIm[a]! - params.pIm[b]!)
  return {
    frequencyCycles: Float64Array.from(order, q => params.pIm[q]! / (2 * Math.PI)),
    dampingNepers: Float64Array.from(order, q => -params.pRe[q]!),
    amplitude: Float64Array.from(order, q => Math.hypot(params.cRe[q]!, params.cIm[q]!)),
    phaseRad: Float64Array.from(order, q => Math.atan2(params.cIm[q]!, params.cRe[q]!)),
    singularValues: start.singularValues,
    residualRms: Math.sqrt(current.sumSq / n),
  }
}

interface Params {
  cRe: Float64Array
  cIm: Float64Array
  pRe: Float64Array
  pIm: Float64Array
}

interface Residual {
  re: Float64Array
  im: Float64Array
  sumSq: number
}

/** y − Σ c_k e^{p_k m} and its squared norm, written into `out` (`powers` is scratch). */
function residual(signal: ComplexSignal, p: Params, powers: ComplexSignal, out: Residual): Residual {
  const n = signal.re.length
  const { re, im } = out
  re.set(signal.re)
  im.set(signal.im)
  for (let q = 0; q < p.cRe.length; q++) {
    const stepMag = Math.exp(p.pRe[q]!)
    const { re: eRe, im: eIm } = complexPowers(stepMag * Math.cos(p.pIm[q]!), stepMag * Math.sin(p.pIm[q]!), n, powers)
    const cr = p.cRe[q]!
    const ci = p.cIm[q]!
    for (let m = 0; m < n; m++) {
      re[m]! -= cr * eRe[m]! - ci * eIm[m]!
      im[m]! -= cr * eIm[m]! + ci * eRe[m]!
    }
  }
  let sumSq = 0
  for (let m = 0; m < n; m++) sumSq += re[m]! * re[m]! + im[m]! * im[m]!
  out.sumSq = sumSq
  return out
}
