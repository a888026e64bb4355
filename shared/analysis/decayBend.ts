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
  // M = Σ w·x xᵀ with x = (1, u, u²), u = t − mean (times centred: conditioning), and Σ w·y·x.
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, r0 = 0, r1 = 0, r2 = 0
  for (let i = 0; i < n; i++) {
    const w = weights[i]!
    const u = timesS[i]! - mean
    const wy = w * levelsDb[i]!
    s0 += w
    s1 += w * u
    s2 += w * u * u
    s3 += w * u * u * u
    s4 += w * u * u * u * u
    r0 += wy
    r1 += wy * u
    r2 += wy * u * u
  }
  // M⁻¹ = C / det, C the (symmetric) cofactors.
  const c00 = s2 * s4 - s3 * s3
  const c01 = s2 * s3 - s1 * s4
  const c02 = s1 * s3 - s2 * s2
  const c11 = s0 * s4 - s2 * s2
  const c12 = s1 * s2 - s0 * s3
  const c22 = s0 * s2 - s1 * s1
  const det = s0 * c00 + s1 * c01 + s2 * c02
  if (!(s2 > 0) || !(Math.abs(det) > 1e-300)) return 0
  // The parabola y ≈ a + b·u + c·u² (M⁻¹·Σ w·y·x), and g = M⁻¹·(0, 1, 2·d₀): its slope at the first point is Σ w·(gᵀx)·y.
  const a = (c00 * r0 + c01 * r1 + c02 * r2) / det
  const b = (c01 * r0 + c11 * r1 + c12 * r2) / det
  const c = (c02 * r0 + c12 * r1 + c22 * r2) / det
  const d0 = 2 * (timesS[0]! - mean)
  const g0 = (c01 + c02 * d0) / det
  const g1 = (c11 + c12 * d0) / det
  const g2 = (c12 + c22 * d0) / det
  // bend = Σ hᵢ·yᵢ with hᵢ = wᵢ·(uᵢ / s2 − gᵀxᵢ) (line slope less the parabola's start slope);
  // its variance σ²·Σ hᵢ²/wᵢ, σ² = Σ w·r² / (n − 3) of the parabola.
  let bend = 0
  let sumH2OverW = 0
  let sumSq = 0
  for (let i = 0; i < n; i++) {
    const w = weights[i]!
    const u = timesS[i]! - mean
    const y = levelsDb[i]!
    const h = w * (u / s2 - (g0 + g1 * u + g2 * u * u))
    bend += h * y
    if (w > 0) sumH2OverW += (h * h) / w
    const residual = y - (a + b * u + c * u * u)
    sumSq += w * residual * residual
  }
  const squared = bend * bend - (sumSq / (n - 3)) * sumH2OverW
  return Number.isFinite(squared) && squared > 0 ? Math.sign(bend) * Math.sqrt(squared) : 0
}
