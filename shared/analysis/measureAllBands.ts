import { MAIN_LOBE_BINS } from './chooseWindow'
import type { StrikeSpan } from './findStrike'
import { fitLine } from './fitLine'
import type { TrackPoint } from './linkTracks'
import { measureBand, type BandMeasurement, type BandSettings } from './measureBand'
import type { TrackMeasurement } from './measureTrack'
import { mergeBands } from './mergeBands'
import { dropHeldInPairZones, inPairZone } from './pairZones'
import type { AnalysisBand } from './planBands'
import type { ReportFloor } from './reportFloor'
import { windowSpan } from './windowSpan'

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
 * saves most of the fast bands' work.
 */
export function measureAllBands(
  signal: Float64Array,
  sampleRate: number,
  strike: StrikeSpan,
  bands: readonly AnalysisBand[],
  settings: BandSettings & { maxDropPerWindowDb: number },
  /** The reporting floor, kept up to date with every reading (lets weak tracks cost little). */
  floor?: ReportFloor,
): AllBands {
  const measured: BandMeasurement[] = []
  let merged: TrackMeasurement[] = []
  // Tracks of one band often share their long span (frame times on the hop grid): window it once.
  // A span is used only while its track is measured, so an evicted span's memory is
  // reused for the next one rather than allocated afresh (long spans are ~0.8 MB each).
  const cache = new Map<string, Float64Array>()
  const windowed = (start: number, length: number) => {
    const key = `${start}:${length}`
    let span = cache.get(key)
    if (!span) {
      let spare: Float64Array | undefined
      if (cache.size >= 16) {
        const oldest = cache.keys().next().value!
        spare = new Float64Array(cache.get(oldest)!.buffer)
        cache.delete(oldest)
      }
      span = windowSpan(signal, start, length, 0, 0, spare).windowed
      cache.set(key, span)
    }
    return span
  }
  for (const band of bands) {
    const reachHz = MAIN_LOBE_BINS / 2 / band.windowS
    const settled = (points: TrackPoint[]) => {
      const frequencyHz = points[points.length >> 1]!.frequencyHz
      const held = merged.find(m => Math.abs(m.frequencyHz - frequencyHz) < reachHz)
      if (held && inPairZone(frequencyHz, band.pairZonesHz)) return true
      if (!held || points.length < 2) return false
      const decayDbPerS = -fitLine(points.map(p => p.timeS), points.map(p => p.amplitudeDb)).slope
      return decayDbPerS * held.windowS <= settings.maxDropPerWindowDb
    }
    const band_ = measureBand(signal, sampleRate, strike, band, settings, settled, windowed, floor)
    band_.partials = dropHeldInPairZones(band_.partials, merged, band.pairZonesHz, reachHz)
    measured.push(band_)
    merged = measured.length === 1 ? band_.partials : mergeBands([merged, band_.partials], settings.maxDropPerWindowDb)
  }
  return { measured, merged }
}
