import { smearedWithin } from './mergeBands'

/** Whether `frequencyHz` lies inside one of `zonesHz` (closed ranges, Hz). */
export function inPairZone(frequencyHz: number, zonesHz: readonly (readonly [number, number])[]): boolean {
  for (const [lo, hi] of zonesHz) if (frequencyHz >= lo && frequencyHz <= hi) return true
  return false
}

/**
 * How much weaker (onset amplitude, dB) a slower band's partial may be than a faster band's
 * reading and still be the same partial: an unresolved pair reads at most 6 dB over its
 * stronger member (in phase), and a beat can steepen the fast fit's line a little more.
 */
export const PAIR_HELD_WITHIN_DB = 12

/** A slower reading, and the window it was read in (s) where known. */
export interface HeldReading { frequencyHz: number, amplitudeDb: number, windowS?: number }

/** How fast the faster reading falls, and the most a slower window may see it fall and still read it (mergeBands' rule). */
export interface FallLimit { decayDbPerS: number, maxDropPerWindowDb: number }

/**
 * Whether a slower band's partial holds a faster reading at `frequencyHz` of `levelDb`: within
 * `reachHz` and not more than PAIR_HELD_WITHIN_DB weaker. A strong short-lived partial (a
 * xylophone's ×3) among a room's faint comb resonances, which the slow window reads as a pair
 * 40 dB under it, is not held by them. Nor, given `fall`, by a lone slower reading whose window
 * it falls more than the limit within: that window smeared it (a ×3 of T60 0.2 s read 12–17 dB
 * low at a third of its decay). Two slower readings of like level there (a pair the slower
 * window resolved, a tabla's ringing modes 20 Hz apart) hold it whatever its fall.
 */
export function heldBy(held: readonly HeldReading[], frequencyHz: number, levelDb: number, reachHz: number, fall?: FallLimit): boolean {
  const near = held.filter(h => Math.abs(h.frequencyHz - frequencyHz) < reachHz && h.amplitudeDb >= levelDb - PAIR_HELD_WITHIN_DB)
  // Two slower readings there are a pair the slower window resolved: they hold it, however it falls.
  if (near.length !== 1 || !fall) return near.length > 0
  const [h] = near
  return !(h!.windowS !== undefined && smearedWithin(fall.decayDbPerS, h!.windowS, fall.maxDropPerWindowDb))
}

/**
 * A fast band's partials, less those inside its pair zones (neighbours its window cannot
 * resolve) that a slower band already holds within `reachHz` (heldBy): there the fast band would
 * read two partials as one, so it may only add what the slower bands missed.
 */
export function dropHeldInPairZones<P extends { frequencyHz: number, amplitudeDb: number, decayDbPerS?: number }>(
  partials: readonly P[],
  held: readonly HeldReading[],
  zonesHz: readonly (readonly [number, number])[],
  reachHz: number,
  maxDropPerWindowDb?: number,
): P[] {
  if (zonesHz.length === 0) return [...partials]
  const fallOf = (p: P): FallLimit | undefined => (maxDropPerWindowDb !== undefined && p.decayDbPerS !== undefined ? { decayDbPerS: p.decayDbPerS, maxDropPerWindowDb } : undefined)
  return partials.filter(p => !inPairZone(p.frequencyHz, zonesHz) || !heldBy(held, p.frequencyHz, p.amplitudeDb, reachHz, fallOf(p)))
}
