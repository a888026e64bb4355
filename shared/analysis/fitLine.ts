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
 * Least-squares line through (x, y), optionally weighted (weighted least squares:
 * minimises Σ wᵢ (yᵢ − a − b xᵢ)²; normal equations in centred form, which avoids the
 * cancellation of raw sums). r² is the weighted coefficient of determination.
 * Needs at least two distinct x with positive weight.
 */
export function fitLine(x: ArrayLike<number>, y: ArrayLike<number>, weights?: ArrayLike<number>): LineFit {
  const n = x.length
  if (n !== y.length || n < 2) throw new RangeError('fitLine needs two arrays of equal length ≥ 2')
  if (weights && weights.length !== n) throw new RangeError('fitLine needs one weight per point')
  let sw = 0
  let mx = 0
  let my = 0
  for (let i = 0; i < n; i++) {
    const w = weights ? weights[i]! : 1
    sw += w
    mx += w * x[i]!
    my += w * y[i]!
  }
  if (!(sw > 0)) throw new RangeError('fitLine needs positive weights')
  mx /= sw
  my /= sw
  let sxx = 0
  let sxy = 0
  let syy = 0
  for (let i = 0; i < n; i++) {
    const w = weights ? weights[i]! : 1
    const dx = x[i]! - mx
    const dy = y[i]! - my
    sxx += w * dx * dx
    sxy += w * dx * dy
    syy += w * dy * dy
  }
  if (!(sxx > 0)) throw new RangeError('fitLine needs at least two distinct x values')
  const slope = sxy / sxx
  const intercept = my - slope * mx
  const residuals = new Float64Array(n)
  let ssRes = 0
  for (let i = 0; i < n; i++) {
    const r = y[i]! - (intercept + slope * x[i]!)
    residuals[i] = r
    ssRes += (weights ? weights[i]! : 1) * r * r
  }
  return { slope, intercept, r2: syy > 0 ? 1 - ssRes / syy : 0, residuals }
}
