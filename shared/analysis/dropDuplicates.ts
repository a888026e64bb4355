import type { TrackMeasurement } from './measureTrack'

/**
 * A partial can be tracked twice (a track that broke in a beat null and started again):
 * keep the longer track of any two closer than the resolution of their long windows.
 * Returns the kept partials by ascending frequency.
 */
export function dropDuplicates(measured: readonly TrackMeasurement[]): TrackMeasurement[] {
  const byLength = [...measured].sort((a, b) => b.frames - a.frames || b.amplitudeDb - a.amplitudeDb)
  // Kept partials by frequency: a clash can only lie within 1 / (the shortest span of all) of m, so a
  // binary search finds where to look (a dense strike — a cymbal's hundreds of readings — stays cheap).
  let shortestS = Infinity
  for (const m of measured) shortestS = Math.min(shortestS, m.refineSpanS)
  const reachHz = 1 / shortestS
  const kept: TrackMeasurement[] = []
  for (const m of byLength) {
    let at = firstAbove(kept, m.frequencyHz - reachHz)
    let clash = false
    for (; at < kept.length && kept[at]!.frequencyHz <= m.frequencyHz + reachHz && !clash; at++) {
      const k = kept[at]!
      clash = Math.abs(k.frequencyHz - m.frequencyHz) < 1 / Math.min(k.refineSpanS, m.refineSpanS)
    }
    if (!clash) kept.splice(firstAbove(kept, m.frequencyHz, true), 0, m)
  }
  return kept
}

/** Index of the first partial at or above `hz` (strictly above when `after`: equal ones keep their order) in a list sorted by frequency. */
function firstAbove(sorted: readonly TrackMeasurement[], hz: number, after = false): number {
  let lo = 0
  let hi = sorted.length
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    const f = sorted[mid]!.frequencyHz
    if (f < hz || (after && f === hz)) lo = mid + 1
    else hi = mid
  }
  return lo
}
