import { firstAtOrAbove } from './firstAtOrAbove'
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
    let at = firstAtOrAbove(kept, m.frequencyHz - reachHz)
    let clash = false
    for (; at < kept.length && kept[at]!.frequencyHz <= m.frequencyHz + reachHz && !clash; at++) {
      const k = kept[at]!
      clash = Math.abs(k.frequencyHz - m.frequencyHz) < 1 / Math.min(k.refineSpanS, m.refineSpanS)
    }
    if (!clash) kept.splice(firstAtOrAbove(kept, m.frequencyHz, true), 0, m)
  }
  return kept
}
