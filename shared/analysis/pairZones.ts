/** Whether `frequencyHz` lies inside one of `zonesHz` (closed ranges, Hz). */
export function inPairZone(frequencyHz: number, zonesHz: readonly (readonly [number, number])[]): boolean {
  for (const [lo, hi] of zonesHz) if (frequencyHz >= lo && frequencyHz <= hi) return true
  return false
}

/**
 * A fast band's partials, less those inside its pair zones (neighbours its window cannot
 * resolve) that a slower band already holds within `reachHz`: there the fast band would
 * read two partials as one, so it may only add what the slower bands missed.
 */
export function dropHeldInPairZones<P extends { frequencyHz: number }>(
  partials: readonly P[],
  held: readonly { frequencyHz: number }[],
  zonesHz: readonly (readonly [number, number])[],
  reachHz: number,
): P[] {
  if (zonesHz.length === 0) return [...partials]
  return partials.filter(p => !inPairZone(p.frequencyHz, zonesHz) || !held.some(h => Math.abs(h.frequencyHz - p.frequencyHz) < reachHz))
}
