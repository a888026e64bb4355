import { MAIN_LOBE_BINS } from './chooseWindow'
import { inputBand } from './inputBand'
import type { LongPeak } from './longSpectrumPeaks'
import { measureLongPeak } from './measureLongPeak'
import type { MeasuredPartial } from './types'
import { windowBand } from './windowBand'

export interface LongLookSettings {
  /** The long window: first sample and length, and the onset (amplitudes refer to it). */
  startIndex: number
  length: number
  onsetIndex: number
  /** Window of the slowest band, s: only peaks with a strong neighbour inside its main lobe are looked at. */
  bandWindowS: number
  /** Bounds of a believable amplitude, dB re full scale: the file's peak (plus margin) and the reported range's floor. */
  maxAmplitudeDb: number
  minAmplitudeDb: number
  /** Slowest and fastest believable decay of a partial of a strike, dB/s. */
  minDecayDbPerS: number
  maxDecayDbPerS: number
  /** Fastest modulation whose sidebands are no partials, Hz. */
  maxModulationHz: number
  /**
   * Candidates lie within this of the strongest peak and this far over the banded floor, dB;
   * `peaks` may reach further down, to show weaker neighbours and mirrors (default: every peak is a candidate).
   */
  belowStrongestDb?: number
  noiseMarginDb?: number
}

/** A peak must stand this far over the dip towards any stronger neighbour, dB (resolved from its lobe). */
const MIN_PROMINENCE_DB = 6
/** Orders of a modulation's sidebands looked for around a reported partial, and around a stronger peak. */
const MAX_SIDEBAND_ORDER = 6
const MAX_MIRROR_ORDER = 2
/**
 * A neighbour inside the slowest band's main lobe counts when it stands at most this far under
 * the candidate: it then pulls the band's lobe about from frame to frame, so the candidate's
 * track breaks up (a timpani's dense skirt of weak modes), dB.
 */
const NEIGHBOUR_WITHIN_DB = 20
/** A mirror peak within this of the candidate's level makes a symmetric family, dB. */
const MIRROR_WITHIN_DB = 10

/**
 * Partials the short-time bands could not resolve, from one long spectrum (its `peaks`,
 * longSpectrumPeaks): a peak within the candidates' range and margin is a candidate when no reported partial lies within one main lobe
 * of the long window, no stronger peak does either (it would be that peak's skirt), it stands
 * `MIN_PROMINENCE_DB` over the dip towards its stronger neighbours,
 * and another peak at most 20 dB under it lies inside the slowest band's main lobe (the bands saw the two
 * as one wandering lobe; a lone peak the bands left out was left out on purpose). A
 * candidate that is one of a symmetric pair around a stronger peak, or k·f_m from a reported
 * partial modulated at f_m, is a sideband (the modulation theorem); a lone companion is a
 * partial. Each candidate is measured over the long window (measureLongPeak: refinement
 * and the matrix pencil) and reported when the pencil confirms a component there that
 * decays as a partial of a strike does, between the reported range's floor and the file's
 * peak. The peaks already stand over the noise by the bands' margin (longSpectrumPeaks).
 */
export function findLongLookPartials(
  signal: Float64Array,
  sampleRate: number,
  peaks: readonly LongPeak[],
  partials: readonly MeasuredPartial[],
  settings: LongLookSettings,
): MeasuredPartial[] {
  const { startIndex, length } = settings
  if (!(startIndex >= 0 && length > 0 && startIndex + length <= signal.length)) throw new RangeError('findLongLookPartials needs a window inside the signal')
  const lobeHz = (MAIN_LOBE_BINS * sampleRate) / length
  const bandLobeHz = MAIN_LOBE_BINS / settings.bandWindowS
  const strongestDb = Math.max(-Infinity, ...peaks.map(p => p.levelDb))
  const candidates = peaks.filter(peak => peak.prominenceDb >= MIN_PROMINENCE_DB
    && peak.levelDb >= strongestDb - (settings.belowStrongestDb ?? Infinity)
    && peak.levelDb - peak.noiseFloorDb >= (settings.noiseMarginDb ?? 0)
    && !peaks.some(other => other.levelDb > peak.levelDb && Math.abs(other.frequencyHz - peak.frequencyHz) < lobeHz)
    && !partials.some(p => Math.abs(p.frequencyHz - peak.frequencyHz) < lobeHz)
    && peaks.some(other => other !== peak && Math.abs(other.frequencyHz - peak.frequencyHz) < bandLobeHz && other.levelDb >= peak.levelDb - NEIGHBOUR_WITHIN_DB)
    && !isSideband(peak, peaks, partials, settings.maxModulationHz, sampleRate / length))
  if (candidates.length === 0) return []
  // One window over the input at its own rate serves every candidate.
  const input = inputBand(signal, sampleRate)
  const windowed = windowBand(input, startIndex, length)
  const found: MeasuredPartial[] = []
  for (const peak of candidates) {
    const nearestHz = Math.min(Infinity, ...peaks.filter(o => o !== peak).map(o => Math.abs(o.frequencyHz - peak.frequencyHz)))
    const reading = measureLongPeak(signal, sampleRate, peak.frequencyHz, {
      windowed,
      input,
      startIndex,
      onsetIndex: settings.onsetIndex,
      halfWidthHz: Math.max(lobeHz / 2, Math.min(nearestHz / 2, lobeHz)),
      levelDb: peak.levelDb,
      noiseFloorDb: peak.noiseFloorDb,
    })
    if (!reading) continue
    if (!(reading.decayDbPerS >= settings.minDecayDbPerS && reading.decayDbPerS <= settings.maxDecayDbPerS)) continue
    if (!(reading.amplitudeDb <= settings.maxAmplitudeDb && reading.amplitudeDb >= settings.minAmplitudeDb)) continue
    found.push(reading)
  }
  return found
}

/**
 * A sideband: a stronger peak lies between it and a mirror peak as far on the other side
 * (within 0.3 Hz, 5 % of the gap or half a bin of the long window — a peak's place in a
 * cluster moves by a fraction of a bin — and within 10 dB of its level either way, as a
 * modulation's sidebands are: a far stronger peak there is a mode of its own), the gap at most
 * twice `maxModulationHz`; or it lies k·f_m (k = 1…6) from a stronger reported partial
 * modulated at f_m.
 */
function isSideband(peak: LongPeak, peaks: readonly LongPeak[], partials: readonly MeasuredPartial[], maxModulationHz: number, binHz: number): boolean {
  const near = (a: number, b: number, gapHz: number) => Math.abs(a - b) <= Math.max(0.3, 0.05 * gapHz, binHz / 2)
  for (const carrier of peaks) {
    const gapHz = Math.abs(peak.frequencyHz - carrier.frequencyHz)
    if (carrier.levelDb <= peak.levelDb || gapHz === 0 || gapHz > MAX_MIRROR_ORDER * maxModulationHz) continue
    const mirrorHz = 2 * carrier.frequencyHz - peak.frequencyHz
    if (peaks.some(m => near(m.frequencyHz, mirrorHz, gapHz) && Math.abs(m.levelDb - peak.levelDb) <= MIRROR_WITHIN_DB)) return true
  }
  return partials.some((p) => {
    const rate = p.modulationHz ?? 0
    if (!(rate > 0 && rate <= maxModulationHz) || p.amplitudeDb < peak.levelDb) return false
    const order = Math.abs(peak.frequencyHz - p.frequencyHz) / rate
    const k = Math.round(order)
    return k >= 1 && k <= MAX_SIDEBAND_ORDER && near(peak.frequencyHz, p.frequencyHz + Math.sign(peak.frequencyHz - p.frequencyHz) * k * rate, rate)
  })
}
