import { MAIN_LOBE_BINS } from './chooseWindow'
import type { TrackMeasurement } from './measureTrack'

/**
 * Merge the partials of the bands, slowest band first. A partial of a faster band that no
 * slower band holds is added (a short-lived partial the long window missed). Where both
 * hold it (within half the faster window's main lobe), the faster band's reading replaces
 * the slower one when the partial falls more than `maxDropPerWindowDb` within one slower
 * window: such a window smears the decay and so misreads decay and onset amplitude.
 * A slower partial is held by the faster partial nearest to it only: two partials the
 * faster band resolved are two partials, so a neighbour inside the same half lobe (a
 * fast-dying mode 48 Hz under a steel note's fundamental) is added, never taken for it.
 */
export function mergeBands(bands: readonly TrackMeasurement[][], maxDropPerWindowDb: number): TrackMeasurement[] {
  const merged = [...(bands[0] ?? [])]
  for (let b = 1; b < bands.length; b++) {
    const fastBand = bands[b]!
    const slowCount = merged.length
    const reachHz = (fast: TrackMeasurement) => MAIN_LOBE_BINS / 2 / fast.windowS
    // The faster partial nearest to each slower one: the only one that can be the same partial.
    const holder = new Map<number, TrackMeasurement>()
    for (let i = 0; i < slowCount; i++) {
      let best: TrackMeasurement | undefined
      for (const fast of fastBand) {
        if (!best || Math.abs(fast.frequencyHz - merged[i]!.frequencyHz) < Math.abs(best.frequencyHz - merged[i]!.frequencyHz)) best = fast
      }
      if (best) holder.set(i, best)
    }
    for (const fast of fastBand) {
      let nearest = -1
      for (let i = 0; i < slowCount; i++) {
        const distance = Math.abs(merged[i]!.frequencyHz - fast.frequencyHz)
        if (holder.get(i) === fast && distance < reachHz(fast) && (nearest < 0 || distance < Math.abs(merged[nearest]!.frequencyHz - fast.frequencyHz))) nearest = i
      }
      if (nearest < 0) merged.push(fast)
      else if (fast.decayDbPerS * merged[nearest]!.windowS > maxDropPerWindowDb) merged[nearest] = fast
    }
  }
  return merged
}
