import { CENTS_PER_LOG, DB_PER_NEPER } from './units'

/** Share of a partial's line half-width allowed for what else sounds within its line (see partialUncertaintyCents). */
export const LINE_PULL_SHARE = 0.05

/**
 * One standard deviation of a partial's frequency in cents, from three independent terms:
 * the Cramér–Rao bound at its measured values (`boundCents`); the spread of its two readings,
 * Δ/√2 (`deltaCents` = Δ, 0 where there is one reading); and 5 % of its line's half-width,
 * α/2π with α its decay in nepers/s — a Type B allowance (JCGM 100:2008, GUM §4.3) for what
 * else sounds within the line, a room's reflections of it or a neighbouring mode, which pulls
 * both readings alike, so their spread does not show it. A slowly decaying partial's line is
 * narrow and the allowance is nothing; a xylophone's ×3 (200 dB/s at 1.5 kHz) gets 0.2 ¢.
 * On 603 random synthetic strikes (sweep-random-strikes, seeds 1, 31 and 32) it brings the
 * partials in rooms read further off than three uncertainties from 13 of 361 to none, dry ones stay at 0 of 242.
 *
 * A fourth term carries the decay's pull into the frequency (`decayPullDbPerS`: the part of the
 * decay's error that the noise does not explain, decayPull.ts). Another
 * sound within the line adds A·ε(t) to the partial A·e^{(−α + iω)t}; log(1 + ε) moves the log level
 * by Re ε and the phase by Im ε, and for a sound of unrelated phase (a room's reflections) both are
 * alike in size. So the error it leaves in the decay, in nepers/s, it leaves in the angular
 * frequency too, in rad/s: u_f = u_α / 2π. A dry partial's decay readings agree and its curve is
 * straight, and the term is next to nothing; where a room's tail bends the curve it grows with it.
 * Xylophone bars in rooms harsher than most (a tail 18–26 dB under the strike; roomUncertainty.test.ts
 * at seeds 2026 and 7–9, 192 partials): further off than three uncertainties 15 without it, 2 with it;
 * further than five, 8 and 1.
 */
export function partialUncertaintyCents(boundCents: number, deltaCents: number, frequencyHz: number, decayDbPerS: number, decayPullDbPerS = 0): number {
  if (!(frequencyHz > 0)) throw new RangeError('partialUncertaintyCents needs a positive frequency')
  const toCents = (nepersPerS: number) => CENTS_PER_LOG * Math.log1p(nepersPerS / (2 * Math.PI * frequencyHz))
  const halfWidthCents = toCents(Math.max(0, decayDbPerS) / DB_PER_NEPER)
  const pullCents = toCents(Math.abs(decayPullDbPerS) / DB_PER_NEPER)
  return Math.hypot(boundCents, deltaCents / Math.SQRT2, LINE_PULL_SHARE * halfWidthCents, pullCents)
}
