import type { BandSource } from './bandSource'
import { onGlideCourse, type PitchGlide } from './findPitchGlide'
import { checkWorkDeadline } from './workDeadline'
import { MAIN_LOBE_BINS } from './chooseWindow'
import type { TrackMeasurement } from './measureTrack'
import { ENGINE_SETTINGS } from './engineSettings'
import { pencilPartial } from './pencilPartial'
import { separateDoublet } from './separateDoublet'
import type { BandComponent } from './estimateBand'
import type { FftPartial, MeasuredPartial } from './types'

/** What the doublet check needs of an FFT partial: its STFT window and where its modulation came from. */
export type DoubletCandidate = FftPartial & Pick<TrackMeasurement, 'windowS' | 'modulationFrom' | 'decayBendDbPerS'>

export interface DoubletSplitSettings {
  /** First sample after the attack, one past the last usable sample, and the onset (amplitudes refer to it). */
  startIndex: number
  endIndex: number
  onsetIndex: number
  /** The file's peak level, dB re full scale, and the margin an amplitude may exceed it by. */
  peakDb: number
  peakMarginDb: number
  /** Floor of the reported range, dB re full scale: both components must reach it. */
  minAmplitudeDb: number
  /** Where the strike's loudest sound glides (findPitchGlide): a glide read as two decaying components is no doublet. */
  glide?: PitchGlide | null
  /** Decimated bands of `signal` (bandSource), for the pencil's down-mix. */
  bands?: BandSource
}

export interface SplitDoublets<P extends DoubletCandidate> {
  /** FFT partials left as they were. */
  single: P[]
  /** Partials that were two: each component on its own, read by the matrix pencil. */
  pairs: MeasuredPartial[]
}

/** Both components this far over the band's noise, dB. */
const MIN_SNR_DB = 20
/** The weaker component at most this far under the stronger, dB. */
const MAX_LEVEL_GAP_DB = 25
/** Only partials within this of the strongest are examined (the tuned ones; each costs a pencil fit), dB. */
const MAX_BELOW_STRONGEST_DB = 30
/** Half-width of the band searched around the FFT reading, Hz (a bar's twisting mode lies a few Hz off). */
const SEARCH_HALF_WIDTH_HZ = 8
/** Longest span the pair is measured over, s. */
const MAX_SPAN_S = 1.5
/** The pencil resolves a pair when the span holds this many beats and the gap is this many bound widths. */
const MIN_BEATS = 1
const MIN_BOUND_WIDTHS = 8
/** The FFT track's decay may lie this fraction of it outside the range of the two components' decays. */
const MAX_DECAY_MISMATCH = 0.6
/** Tremolo rates looked for (engineSettings: 1.5–12 Hz). */
const TREMOLO_RATES_HZ = { min: ENGINE_SETTINGS.modulation.minRateHz, max: ENGINE_SETTINGS.modulation.maxRateHz }
/** A gap within 5 % of another partial's tremolo rate is that tremolo (both rates are read to a fraction of a per cent). */
const SAME_RATE_SHARE = 0.05

/**
 * Two partials inside one FFT main lobe (a bell's or a steel note's doublet, a bar's twisting
 * mode beside a bending mode) reported as two, each with its own frequency, decay and
 * amplitude from the matrix pencil (separateDoublet, Hua & Sarkar 1990). Partials within 30 dB
 * of the strongest are examined; one is split
 * only when both components stand ≥ 20 dB over the band's noise and within 25 dB of each
 * other, their gap is below the STFT window's resolution (half its main lobe) yet holds at
 * least one beat over the span and 8 bound widths, the pair's power centroid lies within
 * the gap of the FFT reading, each component holds 20 dB of SNR over a whole beat (so an
 * attack transient beside a partial is no doublet), the FFT track's decay lies between the two
 * components' decays, within 60 % of itself (decaysAsTrack), and the gap is not the rate of a tremolo whose sidebands the
 * FFT path found on this partial or, within 5 %, on any other (a 2 Hz tremolo's upper sideband of a vibraphone's ×4
 * was split off as a doublet partner at −12 dB), nor a pair it already resolved; nor is a partial on the course of a pitch
 * glide (findPitchGlide: a pitch that moves reads as two decaying components, not two modes). The two beat at their difference
 * (`beatHz`, `modulationHz`, depth 20·log10((A₁ + A₂)/|A₁ − A₂|)).
 */
export function splitDoublets<P extends DoubletCandidate>(
  signal: Float64Array,
  sampleRate: number,
  partials: readonly P[],
  settings: DoubletSplitSettings,
): SplitDoublets<P> {
  const { startIndex, onsetIndex } = settings
  const endIndex = Math.min(settings.endIndex, signal.length)
  if (!(startIndex >= 0 && startIndex < endIndex)) throw new RangeError('splitDoublets needs a span inside the signal')
  const single: P[] = []
  const pairs: MeasuredPartial[] = []
  const floorDb = Math.max(-Infinity, ...partials.map(p => p.amplitudeDb)) - MAX_BELOW_STRONGEST_DB
  // A tremolo (a vibraphone's rotating discs) modulates every partial of the strike at one rate,
  // but a weak overtone's own spectrum may not show it: the rates any partial's sidebands showed.
  const tremoloRatesHz = partials
    .filter(q => q.modulationFrom === 'sidebands' && q.modulationHz !== null && q.modulationHz >= TREMOLO_RATES_HZ.min && q.modulationHz <= TREMOLO_RATES_HZ.max)
    .map(q => q.modulationHz!)
  for (const p of partials) {
    checkWorkDeadline()
    const split = p.modulationFrom === 'pair' || p.snrDb < MIN_SNR_DB || p.amplitudeDb < floorDb || onGlideCourse(settings.glide ?? null, p.frequencyHz) ? null : splitOne(p)
    if (split) pairs.push(...split)
    else single.push(p)
  }
  return { single, pairs }

  function splitOne(p: P): [MeasuredPartial, MeasuredPartial] | null {
    let neighbourHz = Infinity
    for (const q of partials) if (q !== p) neighbourHz = Math.min(neighbourHz, Math.abs(q.frequencyHz - p.frequencyHz))
    const halfWidthHz = Math.min(SEARCH_HALF_WIDTH_HZ, neighbourHz / 2, 0.45 * p.frequencyHz, 0.45 * (sampleRate / 2 - p.frequencyHz))
    if (!(halfWidthHz > 0.5)) return null
    const decay = Math.max(p.decayDbPerS, 0.5)
    const spanS = Math.min(MAX_SPAN_S, Math.max(0.1, (Math.min(p.snrDb, 70) + 10) / decay))
    const end = Math.min(endIndex, startIndex + Math.round(spanS * sampleRate))
    if (end - startIndex < 256) return null
    const pair = separateDoublet(signal, sampleRate, p.frequencyHz, { startIndex, endIndex: end, halfWidthHz, referenceIndex: onsetIndex, bands: settings.bands })
    if (!pair) return null
    const [a, b] = pair
    const usedS = (end - startIndex) / sampleRate
    const gapHz = b.frequencyHz - a.frequencyHz
    const levels = [a, b].map(c => 20 * Math.log10(c.amplitude))
    const power = a.amplitude ** 2 + b.amplitude ** 2
    const centroidHz = (a.frequencyHz * a.amplitude ** 2 + b.frequencyHz * b.amplitude ** 2) / power
    const tremoloRate = (p.modulationFrom === 'sidebands' && p.modulationHz !== null && Math.abs(gapHz - p.modulationHz) < 0.2 * p.modulationHz)
      || tremoloRatesHz.some(rateHz => Math.abs(gapHz - rateHz) < SAME_RATE_SHARE * rateHz)
    const physical = [a, b].every((c, k) => Number.isFinite(c.frequencyHz) && c.decayDbPerS >= 0 && levels[k]! <= settings.peakDb + settings.peakMarginDb && levels[k]! >= settings.minAmplitudeDb)
    if (!physical || tremoloRate) return null
    if (Math.min(a.snrDb, b.snrDb) < MIN_SNR_DB || Math.abs(levels[0]! - levels[1]!) > MAX_LEVEL_GAP_DB) return null
    if (gapHz >= MAIN_LOBE_BINS / 2 / p.windowS || gapHz * usedS < MIN_BEATS) return null
    if (gapHz < MIN_BOUND_WIDTHS * Math.hypot(a.frequencySdHz, b.frequencySdHz)) return null
    if (Math.abs(centroidHz - p.frequencyHz) > gapHz) return null
    // Each holds its SNR over a whole beat (an attack transient beside a partial dies first).
    if ([a, b].some(c => c.snrDb - c.decayDbPerS / gapHz < MIN_SNR_DB)) return null
    if (!decaysAsTrack(p.decayDbPerS, a, b)) return null
    const depthDb = Math.min(60, 20 * Math.log10((a.amplitude + b.amplitude) / Math.max(Math.abs(a.amplitude - b.amplitude), 1e-12)))
    const context = { startS: startIndex / sampleRate, endS: end / sampleRate, beatHz: gapHz, modulationHz: gapHz, modulationDepthDb: depthDb }
    return [pencilPartial(a, context), pencilPartial(b, context)]
  }
}

/**
 * The FFT track's decay fits the pair: it lies between the two components' decays, give or take
 * 60 % of itself. A short window's frames follow their sum, which falls at the faster rate while the
 * stronger one leads and at the slower one after (steel drum B4's ×2, 982.1 and 989.8 Hz at 56 and
 * 166 dB/s, read as one partial at 96.5 dB/s); a track that decays as either component does is
 * inside that range too. An attack transient beside a partial is no doublet either way: it does
 * not hold its SNR over a whole beat (checked before).
 */
function decaysAsTrack(trackDecayDbPerS: number, a: BandComponent, b: BandComponent): boolean {
  const slack = Math.max(MAX_DECAY_MISMATCH * trackDecayDbPerS, 2)
  return trackDecayDbPerS >= Math.min(a.decayDbPerS, b.decayDbPerS) - slack && trackDecayDbPerS <= Math.max(a.decayDbPerS, b.decayDbPerS) + slack
}
