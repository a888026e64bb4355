import type { BandSource } from './bandSource'
import { estimateBand, type BandComponent } from './estimateBand'
import { MIRROR_WITHIN_DB } from './mirroredSideband'

export interface DoubletSettings {
  /** First and one-past-last sample that may be used. */
  startIndex: number
  endIndex: number
  /** Half-width of the band searched around `centerHz`, in Hz (both partials lie inside it). */
  halfWidthHz: number
  /** Sample the amplitudes refer to (default startIndex). */
  referenceIndex?: number
  /** Decimated bands of `signal` (bandSource), for the pencil's down-mix. */
  bands?: BandSource
}

/**
 * Two partials inside one FFT main lobe — the split modes of a bell or a steel note, a
 * bar's twisting mode beside a bending mode — each with its own frequency, decay and
 * amplitude: the matrix pencil on the band (estimateBand) with at least two exponentials,
 * keeping the two strongest within `halfWidthHz` of `centerHz`, lower first.
 * Returns null when fewer than two components stand over the noise there, and when the
 * weaker of the two has a mirror image about the stronger (isTremoloTriplet): that is a
 * carrier with a tremolo's two sidebands, not two partials.
 */
export function separateDoublet(
  signal: Float64Array,
  sampleRate: number,
  centerHz: number,
  settings: DoubletSettings,
): [BandComponent, BandComponent] | null {
  if (!(settings.halfWidthHz > 0)) throw new RangeError('separateDoublet needs a positive half-width')
  const band = estimateBand(signal, sampleRate, centerHz, {
    startIndex: settings.startIndex,
    endIndex: settings.endIndex,
    halfWidthHz: settings.halfWidthHz,
    targetSamples: 48,
    minOrder: 2,
    maxOrder: 6,
    referenceIndex: settings.referenceIndex,
    bands: settings.bands,
  })
  if (!band) return null
  const inside = band.components
    .filter(c => Math.abs(c.frequencyHz - centerHz) <= settings.halfWidthHz && c.snrDb > 6)
    .sort((a, b) => b.amplitude - a.amplitude)
  if (inside.length < 2) return null
  if (isTremoloTriplet(inside[0]!, inside[1]!, inside.slice(2))) return null
  const pair = [inside[0]!, inside[1]!].sort((a, b) => a.frequencyHz - b.frequencyHz)
  return [pair[0]!, pair[1]!]
}

/** The mirror lies within this share of the gap from where it should (rates read to a few per cent). */
const MIRROR_SHARE = 0.1

/**
 * A carrier and one sideband of an amplitude modulation: the modulation theorem puts a second
 * sideband of equal level on the carrier's other side, A·m/2 at f ± f_m; a second partial has no
 * such mirror. `others` are the band's remaining components.
 */
export function isTremoloTriplet(carrier: BandComponent, side: BandComponent, others: readonly BandComponent[]): boolean {
  const gapHz = Math.abs(side.frequencyHz - carrier.frequencyHz)
  const mirrorHz = 2 * carrier.frequencyHz - side.frequencyHz
  return others.some(o => Math.abs(o.frequencyHz - mirrorHz) <= MIRROR_SHARE * gapHz
    && Math.abs(20 * Math.log10(o.amplitude / side.amplitude)) <= MIRROR_WITHIN_DB)
}
