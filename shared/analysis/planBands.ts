import { MAIN_LOBE_BINS, type WindowChoice } from './chooseWindow'
import { windowLayout } from './windowLayout'

/** One resolution of the multi-resolution analysis: a window and the band it measures. */
export interface AnalysisBand extends WindowChoice {
  /** Lowest frequency peaks are picked at (a little under ownFromHz, so edges are clean), Hz. */
  fromHz: number
  /** Partials from ownFromHz up belong to this band, Hz. */
  ownFromHz: number
  toHz: number
  /** One past the last sample analysed in this band. */
  endIndex: number
  /**
   * Ranges around neighbours this band's window cannot resolve, Hz: there it only adds a
   * partial no slower band holds (a short-lived one), never re-reads a held one (pairZones.ts).
   */
  pairZonesHz: [number, number][]
}

export interface BandPlanSettings {
  shortestWindowS: number
  bandWindowRatio: number
  fastBandFrames: number
}

/**
 * Neighbours closer than this many main lobes are a pair the band cannot resolve. A
 * Blackman–Harris main lobe is 8 bins wide, its sidelobes 92 dB down (Harris 1978): 6 bins
 * apart, each peak and the bins beside it lie outside the other's main lobe.
 */
const PAIR_LOBES = 0.75

/**
 * Multi-resolution layout: band 0 is the long window (chooseWindow) over the whole band
 * and span; then windows `bandWindowRatio` times shorter each, down to `shortestWindowS`,
 * each measuring only where it still resolves the partials — above 1.25 main lobes from DC
 * (as chooseWindow asks of the lowest partial); around every pair of neighbours (within one
 * list) closer than 0.75 main lobes (PAIR_LOBES) it only adds what the slower bands missed (its
 * `pairZonesHz`), so a vibrato family or a doublet high up does not take the fast bands away
 * from the short-lived partials below and beside it — with a hop of a quarter window over its first
 * `fastBandFrames` frames. Long windows where partials are low and close, short ones where
 * they are high and die fast (a multi-resolution spectrum: window length chosen per band, as in a constant-Q analysis, Brown 1991, JASA 89(1)).
 */
export function planBands(
  long: WindowChoice,
  neighbourLists: readonly (readonly number[])[],
  sampleRate: number,
  span: { startIndex: number, endIndex: number },
  range: { minHz: number, maxHz: number },
  settings: BandPlanSettings,
): AnalysisBand[] {
  const bands: AnalysisBand[] = [{ ...long, fromHz: range.minHz, ownFromHz: range.minHz, toHz: range.maxHz, endIndex: span.endIndex, pairZonesHz: [] }]
  const margin = 1.25
  // Down by bandWindowRatio each time, the last one at the shortest window.
  let floorHz = range.minHz
  let previousS = long.windowS
  while (previousS > 1.5 * settings.shortestWindowS) {
    const windowS = Math.max(settings.shortestWindowS, previousS / settings.bandWindowRatio)
    const lobeHz = MAIN_LOBE_BINS / windowS
    const ownFromHz = Math.max(floorHz, margin * lobeHz)
    const pairs: [number, number][] = []
    for (const list of neighbourLists) {
      for (let i = 1; i < list.length; i++) {
        if (list[i]! - list[i - 1]! < PAIR_LOBES * lobeHz) pairs.push([list[i - 1]! - (PAIR_LOBES * lobeHz) / 2, list[i]! + (PAIR_LOBES * lobeHz) / 2])
      }
    }
    if (ownFromHz >= 0.8 * range.maxHz) break
    const windowLength = Math.round(windowS * sampleRate)
    const hop = Math.max(1, Math.round(windowLength / 4))
    bands.push({
      ...windowLayout(windowLength, hop, sampleRate),
      fromHz: Math.max(range.minHz, ownFromHz - lobeHz / 2),
      ownFromHz,
      toHz: range.maxHz,
      endIndex: Math.min(span.endIndex, span.startIndex + settings.fastBandFrames * hop + windowLength),
      pairZonesHz: mergeZones(pairs),
    })
    floorHz = ownFromHz
    previousS = windowS
  }
  return bands
}

/** Overlapping ranges joined, ascending. */
function mergeZones(zones: [number, number][]): [number, number][] {
  const merged: [number, number][] = []
  for (const [lo, hi] of [...zones].sort((a, b) => a[0] - b[0])) {
    const last = merged[merged.length - 1]
    if (last && lo <= last[1]) last[1] = Math.max(last[1], hi)
    else merged.push([lo, hi])
  }
  return merged
}
