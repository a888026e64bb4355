import { BEND_SHARE } from './partialUncertaintyDecayPct'

/** Variance of the FFT path's reading taken as this multiple of the pencil's bound (window loss allowance). */
const FFT_VARIANCE_FACTOR = 2
/**
 * Standard deviation of the difference of an FFT-path reading and the pencil's from their noise,
 * in units of the pencil's bound (the two variances added): for frequencies and decays alike.
 */
export const SPREAD_NOISE = Math.sqrt(1 + FFT_VARIANCE_FACTOR)

/**
 * The part of a partial's decay error that its noise does not explain, dB/s (one standard
 * deviation): the spread Δ of its two decay readings beyond what their noise gives it
 * (√(Δ² − s²), s the standard deviation of Δ from the noise; nothing when Δ is within it), as
 * Δ/√2 is taken for two readings; and the bend of the FFT track's decay curve as bend / √3
 * (partialUncertaintyDecayPct). Both come from something else sounding within the line, such as a
 * room's tail of the partial, which pulls the frequency as much (partialUncertaintyCents).
 */
export function decayPullDbPerS(deltaDbPerS: number, deltaNoiseSdDbPerS: number, bendDbPerS = 0): number {
  // A bound the numerics could not give (NaN) leaves the pull unknown (NaN), as it leaves the bound; a negative one is a bug.
  if (deltaNoiseSdDbPerS < 0) throw new RangeError('decayPullDbPerS needs a noise standard deviation of at least 0')
  const excess = Math.sqrt(Math.max(0, deltaDbPerS * deltaDbPerS - deltaNoiseSdDbPerS * deltaNoiseSdDbPerS))
  return Math.hypot(excess / Math.SQRT2, BEND_SHARE * bendDbPerS)
}
