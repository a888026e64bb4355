/** Standard deviations from the Cramér–Rao bound of one damped sinusoid. */
export interface DampedSinusoidBound {
  /** Of the angular frequency ω, in rad per sample. */
  frequencySdRad: number
  /** Of the damping δ, in nepers per sample (the same value: the two bounds coincide). */
  dampingSdNepers: number
}

/**
 * Cramér–Rao lower bound for x[n] = A·e^{−δn}·cos(ωn + φ) + w[n], n = 0 … N − 1, with
 * w white Gaussian of variance σ² (Yao & Pandit 1995, IEEE Trans. SP 43(4) 878–885; the
 * undamped case is Rife & Boorstyn 1974, IEEE Trans. IT 20(5) 591–598). The Fisher matrix
 * splits into {ω, φ} and {δ, A} blocks, and both give
 *
 *   var(ω̂) = var(δ̂) ≥ (2σ² / A²) · S₀ / (S₀·S₂ − S₁²),   S_k = Σ n^k e^{−2δn}
 *
 * (ω away from 0 and π, so the cos² terms average to ½). With δ = 0 this is Rife &
 * Boorstyn's 24σ² / (A²·N(N² − 1)). For a complex exponential c·zⁿ in complex noise of
 * total variance σ², pass A = 2|c|.
 */
export function dampedSinusoidCrb(amplitude: number, noiseRms: number, dampingNepers: number, samples: number): DampedSinusoidBound {
  if (!(amplitude > 0)) throw new RangeError('dampedSinusoidCrb needs a positive amplitude')
  if (!(noiseRms >= 0) || !Number.isFinite(noiseRms)) throw new RangeError('dampedSinusoidCrb needs a finite noise level of at least zero')
  if (!Number.isFinite(dampingNepers)) throw new RangeError('dampedSinusoidCrb needs a finite damping')
  if (!(Number.isInteger(samples) && samples >= 3)) throw new RangeError('dampedSinusoidCrb needs at least three samples')
  // Sums about the centre of the record keep S₀S₂ − S₁² free of cancellation.
  const centre = (samples - 1) / 2
  const q = Math.exp(-2 * dampingNepers)
  let weight = 1
  let s0 = 0
  let s1 = 0
  let s2 = 0
  for (let n = 0; n < samples; n++) {
    const t = n - centre
    s0 += weight
    s1 += weight * t
    s2 += weight * t * t
    weight *= q
  }
  const determinant = s0 * s2 - s1 * s1
  const variance = ((2 * noiseRms * noiseRms) / (amplitude * amplitude)) * (s0 / determinant)
  const sd = Math.sqrt(variance)
  return { frequencySdRad: sd, dampingSdNepers: sd }
}
