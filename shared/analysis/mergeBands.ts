import { MAIN_LOBE_BINS } from './chooseWindow'
import { decayShownBySpan } from './guardPartials'
import type { TrackMeasurement } from './measureTrack'
import { nearestReading } from './nearestReading'

/**
 * A faster reading this far or further under the slower one is not the same partial (a room's
 * or the noise's fast-dying line in its skirt), dB: the same partial reads alike in both bands,
 * or louder in the faster one when the slower window smears its decay.
 */
export const SAME_PARTIAL_WITHIN_DB = 12

/** Whether a reading falling at `decayDbPerS` falls more than `maxDropPerWindowDb` within a window of `windowS`: that window smears its decay and onset amplitude. */
export function smearedWithin(decayDbPerS: number, windowS: number, maxDropPerWindowDb: number): boolean {
  return decayDbPerS * windowS > maxDropPerWindowDb
}

/**
 * Merge the partials of the bands, slowest band first. A partial of a faster band that no
 * slower band holds is added (a short-lived partial the long window missed), however near
 * another reading of its own band (a partial tracked twice, a fast first stage and then itself:
 * dropDuplicates keeps the longer track). Where both
 * hold it (within half the faster window's main lobe), the faster band's reading replaces
 * the slower one when the partial falls more than `maxDropPerWindowDb` within one slower
 * window (such a window smears the decay and so misreads decay and onset amplitude) and
 * the faster reading is no more than 12 dB under it (else it is another line in its skirt)
 * and falls no further than its track could show (guardPartials would leave it out, and the
 * partial with it).
 * A faster reading 12 dB or more over the slower one is a partial that window misread (a
 * short-lived ×6 whose slower track was fitted to the room's tail after it): it takes that
 * reading's place when it lies within the slower window's own main lobe, and is added beside it
 * otherwise (the slower reading is then another mode).
 * Only the faster reading that holds a slower one (holderOf) may replace it: a pair the faster band
 * split inside its main lobe (a fast-dying ring 48 Hz under a steel note's fundamental in
 * a 75 ms window) must not put its weaker member in the place of the fundamental, nor
 * leave the fundamental out because the ring took its place first. A faster reading is matched
 * to the nearest reading within its reach; where that is a faint line 12 dB or more under it,
 * to the nearest slower reading it misread instead, and the other misreadings of it go.
 */
export function mergeBands(bands: readonly TrackMeasurement[][], maxDropPerWindowDb: number): TrackMeasurement[] {
  let merged = [...(bands[0] ?? [])]
  for (let b = 1; b < bands.length; b++) {
    const fastBand = bands[b]!
    const slowCount = merged.length
    const holders = merged.map(slow => holderOf(slow, fastBand))
    const holder = (i: number) => holders[i]?.fast
    // A slower reading this faster one holds as a misreading of its partial.
    const misreadBy = (i: number, fast: TrackMeasurement) => i < slowCount && holder(i) === fast && holders[i]!.misread
    // Slower readings of a partial whose faster reading took another's place: more misreadings of it.
    const ghosts = new Set<number>()
    for (const fast of fastBand) {
      const reachHz = MAIN_LOBE_BINS / 2 / fast.windowS
      // The nearest reading, unless it is a faint line in this one's skirt and a misreading of this
      // partial lies within reach: then that misreading.
      const closest = nearestReading(merged, fast.frequencyHz, reachHz)
      const faint = closest >= 0 && merged[closest]!.amplitudeDb <= fast.amplitudeDb - SAME_PARTIAL_WITHIN_DB
      const misread = faint ? nearestReading(merged, fast.frequencyHz, reachHz, i => misreadBy(i, fast)) : -1
      const nearest = misread >= 0 ? misread : closest
      if (nearest < 0) {
        merged.push(fast)
        continue
      }
      // Another reading of this band lies within reach: the same partial tracked twice (a fast
      // first stage, then the partial itself) or another; dropDuplicates keeps the longer track.
      if (nearest >= slowCount) {
        merged.push(fast)
        continue
      }
      const slow = merged[nearest]!
      if (holder(nearest) !== fast || !decayShownBySpan(fast)) continue
      if (misreadBy(nearest, fast)) {
        merged[nearest] = fast
        for (let i = 0; i < slowCount; i++) if (i !== nearest && misreadBy(i, fast)) ghosts.add(i)
      }
      else if (fast.amplitudeDb > slow.amplitudeDb + SAME_PARTIAL_WITHIN_DB) merged.push(fast)
      // (The holder is never 12 dB or more under the slower reading: that is checked where it is chosen.)
      else if (smearedWithin(fast.decayDbPerS, slow.windowS, maxDropPerWindowDb)) merged[nearest] = fast
    }
    if (ghosts.size > 0) merged = merged.filter((_, i) => !ghosts.has(i))
  }
  return merged
}

/**
 * The faster reading that can be the same partial as `slow`, the only one that may take its
 * place: the strongest of those 12 dB or more over it inside its window's main lobe (a partial
 * that window misread, however near a faint line lies) whose onset amplitude stands no more than
 * 12 dB over its own strongest frame, else the nearest of those not 12 dB or
 * more under it (another line, however near: a room's faint line 0.5 Hz nearer than a
 * xylophone's ×6). `misread`: the holder is 12 dB or more over it, inside its main lobe.
 */
function holderOf(slow: TrackMeasurement, fastBand: readonly TrackMeasurement[]): { fast: TrackMeasurement, misread: boolean } | undefined {
  const lobeHz = MAIN_LOBE_BINS / 2 / slow.windowS
  let louder: TrackMeasurement | undefined
  let nearest: TrackMeasurement | undefined
  for (const fast of fastBand) {
    const distanceHz = Math.abs(fast.frequencyHz - slow.frequencyHz)
    // Louder as seen: an onset amplitude far over every frame of its track is a line extrapolated back to the blow
    // (a fast component split off a faint track), not a partial the slower window missed.
    const seen = fast.amplitudeDb - fast.strongestFrameDb <= SAME_PARTIAL_WITHIN_DB
    if (seen && fast.amplitudeDb > slow.amplitudeDb + SAME_PARTIAL_WITHIN_DB && distanceHz < lobeHz && (!louder || fast.amplitudeDb > louder.amplitudeDb)) louder = fast
    if (fast.amplitudeDb > slow.amplitudeDb - SAME_PARTIAL_WITHIN_DB && (!nearest || distanceHz < Math.abs(nearest.frequencyHz - slow.frequencyHz))) nearest = fast
  }
  if (louder) return { fast: louder, misread: true }
  return nearest && { fast: nearest, misread: false }
}
