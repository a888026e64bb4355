/**
 * A decay curve's bend (decayBendDbPerS) is taken as the half-width of a rectangular
 * distribution of the line's error (a Type B evaluation, JCGM 100:2008, GUM §4.3.7): u = bend / √3.
 */
export const BEND_SHARE = 1 / Math.sqrt(3)

/**
 * One standard deviation of a partial's decay, in % of it (null when it does not decay), from
 * three independent terms, as partialUncertaintyCents for the frequency: the Cramér–Rao bound at
 * its measured values (`boundDbPerS`); the spread of its two readings, Δ/√2 (`deltaDbPerS` = Δ,
 * 0 where there is one reading); and the bend of the FFT track's decay curve (`bendDbPerS`, 0
 * where there is no track), a room's tail rising under the partial, which pulls both readings alike.
 */
export function partialUncertaintyDecayPct(boundDbPerS: number, deltaDbPerS: number, decayDbPerS: number, bendDbPerS = 0): number | null {
  if (!(decayDbPerS > 0)) return null
  return (100 * Math.hypot(boundDbPerS, deltaDbPerS / Math.SQRT2, BEND_SHARE * bendDbPerS)) / decayDbPerS
}
