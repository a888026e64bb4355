import { guardPartials, type PhysicalBounds } from './guardPartials'
import type { TrackMeasurement } from './measureTrack'

/** The reporting floor as far as the readings made so far show it. */
export interface ReportFloor {
  /** Strongest reading so far that the physical bounds keep, minus the reported range; −∞ before any, dB. */
  levelDb: () => number
  /** Take account of new readings. */
  note: (readings: readonly TrackMeasurement[]) => void
}

/**
 * A running estimate of the floor of the reported range: analyzeChannels reports only
 * partials within `rangeDb` of the strongest one the physical bounds keep (guardPartials).
 * The strongest kept reading so far can only be matched or beaten by later ones, so the
 * floor it gives is at most the final floor: a reading far under it will not be reported,
 * and the costly parts of its measurement can be left out.
 */
export function reportFloor(bounds: PhysicalBounds, rangeDb: number): ReportFloor {
  let strongestDb = -Infinity
  return {
    levelDb: () => strongestDb - rangeDb,
    note: (readings) => {
      for (const kept of guardPartials(readings, bounds).kept) strongestDb = Math.max(strongestDb, kept.amplitudeDb)
    },
  }
}
