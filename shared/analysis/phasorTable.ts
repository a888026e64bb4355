import { complexPowers } from './complexPowers'

/** cos(kθ) and sin(kθ) for k = 0 … count − 1. */
export interface PhasorTable {
  cos: Float64Array
  sin: Float64Array
}

/**
 * The unit phasor e^{ikθ} for k = 0 … count − 1: the powers of e^{iθ} (complexPowers, one
 * complex product per step instead of a cos and a sin: filter design and band mixing need
 * thousands of them). The rounding error grows about linearly with k, ~k·2⁻⁵³ (Goertzel-type
 * recurrences, e.g. Oppenheim & Schafer, Discrete-Time Signal Processing, 3rd ed., §9.2), far
 * below what the taps and gains it feeds need. `out` (at least `count` long) is filled and
 * returned when given.
 */
export function phasorTable(stepRad: number, count: number, out?: PhasorTable): PhasorTable {
  if (!Number.isFinite(stepRad)) throw new RangeError('phasorTable needs a finite step')
  if (!(Number.isInteger(count) && count >= 0)) throw new RangeError('phasorTable needs a whole count ≥ 0')
  const powers = complexPowers(Math.cos(stepRad), Math.sin(stepRad), count, out && { re: out.cos, im: out.sin })
  return { cos: powers.re, sin: powers.im }
}
