/**
 * How far a decay curve bends, dB/s: the decay (−slope) at its first point of the weighted
 * least-squares parabola through (timesS, levelsDb), less the decay of the straight line through
 * the same points — with the part its own noise explains taken out (b̂² − var b̂, an unbiased
 * estimate of the squared bend, the variance from the parabola's residuals: weighted least
 * squares, e.g. Press et al., Numerical Recipes, 3rd ed., §15.4); 0 with fewer than five points.
 * A room's reverberant tail of a partial rises under it as the partial dies and bends the curve
 * up long before a knee shows (findDecayKnee), so the line reads the decay slower than the
 * partial's own; a single exponential in noise does not bend, beyond the noise.
 */
export function decayBendDbPerS(timesS: ArrayLike<number>, levelsDb: ArrayLike<number>, weights: ArrayLike<number>): number {
  const n = timesS.length
  if (levelsDb.length !== n || weights.length !== n) throw new RangeError('decayBendDbPerS needs one level and one weight per time')
  if (n < 5) return 0
  let sw = 0
  let mean = 0
  for (let i = 0; i < n; i++) {
    sw += weights[i]!
    mean += weights[i]! * timesS[i]!
  }
  if (!(sw > 0)) return 0
  mean /= sw
  // M = Σ w·x xᵀ with x = (1, u, u²), u = t − mean (times centred: conditioning).
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0
  for (let i = 0; i < n; i++) {
    const w = weights[i]!
    const u = timesS[i]! - mean
    s0 += w
    s1 += w * u
    s2 += w * u * u
    s3 += w * u * u * u
    s4 += w * u * u * u * u
  }
  const det = s0 * (s2 * s4 - s3 * s3) - s1 * (s1 * s4 - s3 * s2) + s2 * (s1 * s3 - s2 * s2)
  if (!(s2 > 0) || !(Math.abs(det) > 1e-300)) return 0
  // g = M⁻¹·(0, 1, 2·d₀): the parabola's slope at the first point is Σ w·(gᵀx)·y.
  const d0 = 2 * (timesS[0]! - mean)
  const g0 = ((s1 * s4 - s2 * s3) * -1 + (s1 * s3 - s2 * s2) * d0) / det
  const g1 = ((s0 * s4 - s2 * s2) - (s0 * s3 - s1 * s2) * d0) / det
  const g2 = (-(s0 * s3 - s2 * s1) + (s0 * s2 - s1 * s1) * d0) / det
  // bend = Σ hᵢ·yᵢ with hᵢ = wᵢ·(uᵢ / s2 − gᵀxᵢ) (line slope less the parabola's start slope).
  let bend = 0
  let sumH2OverW = 0
  for (let i = 0; i < n; i++) {
    const w = weights[i]!
    const u = timesS[i]! - mean
    const h = w * (u / s2 - (g0 + g1 * u + g2 * u * u))
    bend += h * levelsDb[i]!
    if (w > 0) sumH2OverW += (h * h) / w
  }
  const variance = residualScale(timesS, levelsDb, weights, mean, [s0, s1, s2, s3, s4], det) * sumH2OverW
  const squared = bend * bend - variance
  return Number.isFinite(squared) && squared > 0 ? Math.sign(bend) * Math.sqrt(squared) : 0
}

/** σ² of the weighted parabola fit: Σ w·r² / (n − 3). */
function residualScale(timesS: ArrayLike<number>, levelsDb: ArrayLike<number>, weights: ArrayLike<number>, mean: number, s: number[], det: number): number {
  const [s0, s1, s2, s3, s4] = s as [number, number, number, number, number]
  let r0 = 0, r1 = 0, r2 = 0
  for (let i = 0; i < timesS.length; i++) {
    const u = timesS[i]! - mean
    const wy = weights[i]! * levelsDb[i]!
    r0 += wy
    r1 += wy * u
    r2 += wy * u * u
  }
  // Coefficients a, b, c of y ≈ a + b·u + c·u² by Cramer's rule.
  const a = (r0 * (s2 * s4 - s3 * s3) - s1 * (r1 * s4 - s3 * r2) + s2 * (r1 * s3 - s2 * r2)) / det
  const b = (s0 * (r1 * s4 - s3 * r2) - r0 * (s1 * s4 - s3 * s2) + s2 * (s1 * r2 - r1 * s2)) / det
  const c = (s0 * (s2 * r2 - r1 * s3) - s1 * (s1 * r2 - r1 * s2) + r0 * (s1 * s3 - s2 * s2)) / det
  let sum = 0
  for (let i = 0; i < timesS.length; i++) {
    const u = timesS[i]! - mean
    const r = levelsDb[i]! - (a + b * u + c * u * u)
    sum += weights[i]! * r * r
  }
  return sum / (timesS.length - 3)
}
