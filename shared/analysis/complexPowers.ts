import type { ComplexSignal } from './mixDownBand'

/**
 * The powers zᵐ, m = 0 … count − 1, of z = stepRe + i·stepIm, by the recurrence
 * z^{m+1} = zᵐ·z (one complex product per sample, no exp/cos/sin): the columns of a
 * Vandermonde matrix of damped exponentials (e.g. Hua & Sarkar 1990, eq. 3). `out` (at least
 * `count` long) is filled and returned when given, so a caller's loop allocates nothing.
 * A non-finite z is not refused: its powers come out non-finite, and a least-squares step
 * that diverged is then rejected by its residual rather than by an exception.
 */
export function complexPowers(stepRe: number, stepIm: number, count: number, out?: ComplexSignal): ComplexSignal {
  if (!(Number.isInteger(count) && count >= 0)) throw new RangeError('complexPowers needs a whole count ≥ 0')
  if (out && !(out.re.length >= count && out.im.length >= count)) throw new RangeError('complexPowers needs an output at least count long')
  const powers = out ?? { re: new Float64Array(count), im: new Float64Array(count) }
  const { re, im } = powers
  let zr = 1
  let zi = 0
  for (let m = 0; m < count; m++) {
    re[m] = zr
    im[m] = zi
    const next = zr * stepRe - zi * stepIm
    zi = zr * stepIm + zi * stepRe
    zr = next
  }
  return powers
}
