import { MAIN_LOBE_BINS } from './chooseWindow'
import type { StrikeSpan } from './findStrike'
import { findDecayKnee } from './findDecayKnee'
import { fitLine } from './fitLine'
import type { TrackPoint } from './linkTracks'
import { measureBand, type BandMeasurement, type BandSettings } from './measureBand'
import type { TrackMeasurement } from './measureTrack'
import { mergeBands, SAME_PARTIAL_WITHIN_DB, smearedWithin } from './mergeBands'
import { nearestReading } from './nearestReading'
import { dropHeldInPairZones, heldBy, inPairZone } from './pairZones'
import { bandSource, type BandSource } from './bandSource'
import { wandersOverLobe } from './wandersOverLobe'
import type { AnalysisBand } from './planBands'
import type { ReportFloor } from './reportFloor'

/** Every band measured, slowest first, and their partials merged. */
export interface AllBands {
  measured: BandMeasurement[]
  merged: TrackMeasurement[]
}

/**
 * Measure the bands slowest first and merge them (mergeBands). A faster band's track that
 * the merged partials already hold (within half its main lobe) and that falls less than
 * `maxDropPerWindowDb` within that partial's window — by a quick line through its frame
 * levels — would be discarded by the merge, so it is not measured: on a rich strike that
 * saves most of the fast bands' work. A reading that wanders over its main lobe holds nothing:
 * it will be left out (dropSpuriousPartials), and the faster bands must read that partial themselves.
 */
export function measureAllBands(
  signal: Float64Array,
  sampleRate: number,
  strike: StrikeSpan,
  bands: readonly AnalysisBand[],
  settings: BandSettings & { maxDropPerWindowDb: number },
  /** The reporting floor, kept up to date with every reading (lets weak tracks cost little). */
  floor?: ReportFloor,
  /** Decimated bands of `signal` (bandSource): each track's band is decimated from one DFT of the signal, once, and shared by neighbouring tracks. */
  bandsOf: BandSource = bandSource(signal, sampleRate),
): AllBands {
  const measured: BandMeasurement[] = []
  let merged: TrackMeasurement[] = []
  for (const band of bands) {
    const reachHz = MAIN_LOBE_BINS / 2 / band.windowS
    // A reading that wanders over its main lobe will be left out (a chain of peaks, not one partial): it holds nothing.
    const holding = merged.filter(p => !wandersOverLobe(p))
    const settled = (points: TrackPoint[]) => {
      const frequencyHz = points[points.length >> 1]!.frequencyHz
      const index = nearestReading(holding, frequencyHz, reachHz)
      if (index < 0) return false
      const held = holding[index]!
      let strongestDb = -Infinity
      for (const p of points) strongestDb = Math.max(strongestDb, p.amplitudeDb)
      // A reading far under the track is another line (a room's, in the skirt of a short-lived partial).
      if (held.amplitudeDb < strongestDb - SAME_PARTIAL_WITHIN_DB) return false
      const decayDbPerS = points.length < 2 ? null : firstStageDecay(points)
      if (inPairZone(frequencyHz, band.pairZonesHz)) {
        // Held only by a slower partial of comparable level that its window does not smear
        // (heldBy), judged by the track's strongest frame.
        const fall = decayDbPerS === null ? undefined : { decayDbPerS, maxDropPerWindowDb: settings.maxDropPerWindowDb }
        if (heldBy(holding, frequencyHz, strongestDb, reachHz, fall)) return true
      }
      if (decayDbPerS === null) return false
      return !smearedWithin(decayDbPerS, held.windowS, settings.maxDropPerWindowDb)
    }
    const band_ = measureBand(signal, sampleRate, strike, band, settings, settled, bandsOf, floor)
    band_.partials = dropHeldInPairZones(band_.partials, holding, band.pairZonesHz, reachHz, settings.maxDropPerWindowDb)
    measured.push(band_)
    merged = measured.length === 1 ? band_.partials : mergeBands([merged, band_.partials], settings.maxDropPerWindowDb)
  }
  return { measured, merged }
}

/** Decay of a track's frame levels by a straight line, dB/s, over its first stage when it has a knee (findDecayKnee: a room's slower tail after it). */
function firstStageDecay(points: readonly TrackPoint[]): number {
  const times = points.map(p => p.timeS)
  const levels = points.map(p => p.amplitudeDb)
  const knee = findDecayKnee(times, levels, points.map(() => 1))
  return -fitLine(knee === null ? times : times.slice(0, knee), knee === null ? levels : levels.slice(0, knee)).slope
}
