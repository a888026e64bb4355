/** cos(kθ) and sin(kθ) for k = 0 … count − 1. */
export interface PhasorTable {
  cos: Float64Array
  sin: Float64Array
}

/**
 * The unit phasor e^{ikθ} for k = 0 … count − 1 by the rotation recurrence
 * e^{i(k+1)θ} = e^{ikθ}·e^{iθ} (one complex product per step instead of a cos and a sin:
 * filter design and band mixing need thousands of them). The rounding error grows about
 * linearly with k, ~k·2⁻⁵³ (Goertzel-type recurrences, e.g. Oppenheim & Schafer, Discrete-Time
 * Signal Processing, 3rd ed., §9.2), far below what the taps and gains it feeds need.
 */
export function phasorTable(stepRad: number, count: number): PhasorTable {
  if (!Number.isFinite(stepRad)) throw new RangeError('phasorTable needs a finite step')
  if (!(Number.isInteger(count) && count >= 0)) throw new RangeError('phasorTable needs a whole count ≥ 0')
  const cos = new Float64Array(count)
  const sin = new Float64Array(count)
  const cosStep = Math.cos(stepRad)
  const sinStep = Math.sin(stepRad)
  let c = 1
  let s = 0
  for (let k = 0; k < count; k++) {
    cos[k] = c
    sin[k] = s
    const next = s * cosStep + c * sinStep
    c = c * cosStep - s * sinStep
    s = next
  }
  return { cos, sin }
}
