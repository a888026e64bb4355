/** Least-squares straight line y ≈ intercept + slope · x. */
export interface LineFit {
  slope: number
  intercept: number
  /** Coefficient of determination, 1 − SS_res / SS_tot (1 for a perfect fit; 0 when y is constant). */
  r2: number
  /** y − fitted value, one per point. */
  residuals: Float64Array
}

/**
 * Ordinary least-squares line through (x, y) (Gauss–Legendre normal equations in centred
 * form, which avoids the cancellation of the raw sums). Needs at least two distinct x.
 */
export function fitLine(x: ArrayLike<number>, y: ArrayLike<number>): LineFit {
  const n = x.length
  if (n !== y.length || n < 2) throw new RangeError('fitLine needs two arrays of equal length ≥ 2')
  let mx = 0
  let my = 0
  for (let i = 0; i < n; i++) {
    mx += x[i]!
    my += y[i]!
  }
  mx /= n
  my /= n
  let sxx = 0
  let sxy = 0
  let syy = 0
  for (let i = 0; i < n; i++) {
    const dx = x[i]! - mx
    const dy = y[i]! - my
    sxx += dx * dx
    sxy += dx * dy
    syy += dy * dy
  }
  if (!(sxx > 0)) throw new RangeError('fitLine needs at least two distinct x values')
  const slope = sxy / sxx
  const intercept = my - slope * mx
  const residuals = new Float64Array(n)
  let ssRes = 0
  for (let i = 0; i < n; i++) {
    const r = y[i]! - (intercept + slope * x[i]!)
    residuals[i] = r
    ssRes += r * r
  }
  return { slope, intercept, r2: syy > 0 ? 1 - ssRes / syy : 0, residuals }
}
