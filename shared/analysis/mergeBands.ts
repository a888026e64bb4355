import { MAIN_LOBE_BINS } from './chooseWindow'
import type { TrackMeasurement } from './measureTrack'

/**
 * Merge the partials of the bands, slowest band first. A partial of a faster band that no
 * slower band holds is added (a short-lived partial the long window missed). Where both
 * hold it (within half the faster window's main lobe), the faster band's reading replaces
 * the slower one when the partial falls more than `maxDropPerWindowDb` within one slower
 * window: such a window smears the decay and so misreads decay and onset amplitude.
 */
export function mergeBands(bands: readonly TrackMeasurement[][], maxDropPerWindowDb: number): TrackMeasurement[] {
  const merged = [...(bands[0] ?? [])]
  for (let b = 1; b < bands.length; b++) {
    for (const fast of bands[b]!) {
      const reachHz = MAIN_LOBE_BINS / 2 / fast.windowS
      let nearest = -1
      for (let i = 0; i < merged.length; i++) {
        const distance = Math.abs(merged[i]!.frequencyHz - fast.frequencyHz)
        if (distance < reachHz && (nearest < 0 || distance < Math.abs(merged[nearest]!.frequencyHz - fast.frequencyHz))) nearest = i
      }
      if (nearest < 0) merged.push(fast)
      else if (fast.decayDbPerS * merged[nearest]!.windowS > maxDropPerWindowDb) merged[nearest] = fast
    }
  }
  return merged
}
