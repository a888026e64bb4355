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

/**
 * Whether a slower band's partial holds a faster reading at `frequencyHz` of `levelDb`: within
 * `reachHz` and not more than PAIR_HELD_WITHIN_DB weaker. A strong short-lived partial (a
 * xylophone's ×3) among a room's faint comb resonances, which the slow window reads as a pair
 * 40 dB under it, is not held by them.
 */
export function heldBy(held: readonly { frequencyHz: number, amplitudeDb: number }[], frequencyHz: number, levelDb: number, reachHz: number): boolean {
  return held.some(h => Math.abs(h.frequencyHz - frequencyHz) < reachHz && h.amplitudeDb >= levelDb - PAIR_HELD_WITHIN_DB)
}

/**
 * A fast band's partials, less those inside its pair zones (neighbours its window cannot
 * resolve) that a slower band already holds within `reachHz` (heldBy): there the fast band would
 * read two partials as one, so it may only add what the slower bands missed.
 */
export function dropHeldInPairZones<P extends { frequencyHz: number, amplitudeDb: number }>(
  partials: readonly P[],
  held: readonly { frequencyHz: number, amplitudeDb: number }[],
  zonesHz: readonly (readonly [number, number])[],
  reachHz: number,
): P[] {
  if (zonesHz.length === 0) return [...partials]
  return partials.filter(p => !inPairZone(p.frequencyHz, zonesHz) || !heldBy(held, p.frequencyHz, p.amplitudeDb, reachHz))
}
