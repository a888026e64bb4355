import { BEND_SHARE } from './partialUncertaintyDecayPct'

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
