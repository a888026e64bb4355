import { checkWorkDeadline } from './workDeadline'
import type { BandSource } from './bandSource'
import { centsBetween } from './centsBetween'
import { estimateBand, type BandComponent } from './estimateBand'
import { partialUncertaintyCents } from './partialUncertaintyCents'
import type { FftPartial, MeasuredPartial } from './types'
import { CENTS_PER_LOG, DB_PER_NEPER } from './units'
import { partialUncertaintyDecayPct } from './partialUncertaintyDecayPct'
import { decayPullDbPerS, SPREAD_NOISE } from './decayPull'
import { componentEnergy } from './componentEnergy'

export interface AnnotateSettings {
  /** First sample after the attack, and one past the last sample that may be used. */
  startIndex: number
  endIndex: number
  /** Longest span one partial is measured over, in s (default 1: ample for a cross-check, and the cost grows with it). */
  maxSpanS?: number
  /**
   * The most any component can carry at the span's start (the file's peak with its margin, full
   * scale = 1; default no limit). A fitted amplitude over it is the fit sharing out the attack
   * among lines of no physical size (a mallet's 520 dB/s burst beside xylophone C5's fundamental,
   * fitted 16 dB over the file's peak): it ranks and weighs as if it carried the peak, no more.
   */
  maxAmplitude?: number
  /** Decimated bands of `signal` (bandSource), for the pencil's down-mix. */
  bands?: BandSource
}

/**
 * A partial to annotate: an FFT reading, with how far its decay curve bends where it has one
 * (decayBendDbPerS) and the length of its track's window (windowS: its first frame began half a
 * window before its startS; without it, at startS).
 */
export type AnnotatedInput = FftPartial & { decayBendDbPerS?: number, windowS?: number }

/** Partials with the cross-check and uncertainty filled in, and warnings to add. */
export interface AnnotatedPartials<P extends AnnotatedInput> {
  partials: (P & Pick<MeasuredPartial, 'crossCheckCents' | 'uncertaintyCents' | 'uncertaintyDecayPct'>)[]
  warnings: string[]
}

/** Coverage factor for the disagreement warning (GUM: k = 2, about 95 %). */
const COVERAGE = 2
/** Disagreements below twice the output rounding step (0.01 ¢) are never warned about. */
const WARN_FLOOR_CENTS = 0.02
/** The band reaches at least ±5 ¢ around the FFT reading, so a misread peak is still caught. */
const SEARCH_RATIO = 2 ** (5 / 1200) - 1

/**
 * Cross-check every FFT partial with the matrix pencil (estimateBand) over a span that ends
 * where the partial has sunk into the noise (its SNR + 10 dB of decay, at most `maxSpanS`), in
 * a band a few line-widths and resolution cells (and at least ±5 ¢) wide. The partial's second
 * reading is the inverse-variance weighted mean of the pencil components within one resolution
 * cell (2 / span) of the strongest component in the band's passband (by energy over the time the FFT
 * track saw the partial, none counting for more than `maxAmplitude`, the file's peak).
 * crossCheckCents = pencil − FFT in cents; uncertaintyCents = √(u_bound² + (Δ/√2)² + u_line² + u_pull²)
 * (partialUncertaintyCents), with u_bound the Cramér–Rao bound at the pencil's measured amplitude,
 * decay, span and noise, Δ/√2 the standard deviation of the two readings, u_line 5 % of the line's half-width
 * and u_pull the decay's pull (decayPull: its two readings' spread beyond their noise, and its curve's bend) as a frequency;
 * uncertaintyDecayPct likewise for the decay, with the bend of the FFT track's decay curve (decayBendDbPerS:
 * a room's tail rising under the partial) in place of the line's allowance, as bend / √3.
 * The partials where |Δ| exceeds k = 2 times the combined uncertainty of the two readings are named
 * in one warning, those the pencil could not read in another.
 */
export function annotatePartials<P extends AnnotatedInput>(
  signal: Float64Array,
  sampleRate: number,
  partials: readonly P[],
  settings: AnnotateSettings,
): AnnotatedPartials<P> {
  const { startIndex } = settings
  const endIndex = Math.min(settings.endIndex, signal.length)
  if (!(startIndex >= 0 && startIndex < endIndex)) throw new RangeError('annotatePartials needs a span inside the signal')
  const maxSpanS = settings.maxSpanS ?? 1
  const maxAmplitude = settings.maxAmplitude ?? Infinity
  const unchecked: [number, string][] = []
  const disagreeing: [number, string][] = []
  const out = partials.map((p) => {
    checkWorkDeadline()
    const none = { ...p, crossCheckCents: null, uncertaintyCents: null, uncertaintyDecayPct: null }
    const decay = Math.max(p.decayDbPerS, 0.5)
    const spanS = Math.min(maxSpanS, Math.max(0.02, (Math.min(Math.max(p.snrDb, 20), 70) + 10) / decay))
    const end = Math.min(endIndex, startIndex + Math.round(spanS * sampleRate))
    const usedS = (end - startIndex) / sampleRate
    const lineWidthHz = decay / DB_PER_NEPER / (2 * Math.PI)
    const halfWidthHz = Math.min(0.45 * p.frequencyHz, 0.45 * (sampleRate / 2 - p.frequencyHz), Math.max(2, 4 / usedS, 3 * lineWidthHz, p.frequencyHz * SEARCH_RATIO))
    if (!(halfWidthHz > 0) || end - startIndex < 64) return none
    // A band the estimator cannot read (digital silence) leaves the partial unchecked.
    const band = estimateBand(signal, sampleRate, p.frequencyHz, { startIndex, endIndex: end, halfWidthHz, targetSamples: 32, maxOrder: 4, bands: settings.bands })
    // The time the FFT track saw the partial, within the band's span.
    const spanStartS = startIndex / sampleRate
    const fromS = Math.min(Math.max(0, p.startS - (p.windowS ?? 0) / 2 - spanStartS), usedS)
    const toS = Math.max(fromS, Math.min(usedS, p.endS - spanStartS))
    const near = band?.components.filter(c =>
      Number.isFinite(c.frequencyHz) && Number.isFinite(c.decayDbPerS) && Number.isFinite(c.frequencySdHz)
      && Math.abs(c.frequencyHz - p.frequencyHz) <= band.halfWidthHz && c.snrDb > 6).map(c => physical(c, maxAmplitude)) ?? []
    if (near.length === 0) {
      unchecked.push([p.frequencyHz, `${p.frequencyHz.toFixed(2)} Hz`])
      return none
    }
    // Components closer than a resolution cell (2 / span) to the strongest one (by energy over
    // the time the FFT track saw the partial: a transient of the attack or the room may start louder
    // and be gone before the track's first frame) are
    // one FFT peak (a beating pair, an envelope that is not a single exponential): compare the FFT
    // with their inverse-variance weighted mean (a pair of like decays weighs as its powers; a
    // transient, whose frequency the span hardly fixes, barely counts), and carry the strongest one's bound.
    const seen = (c: BandComponent) => (toS > fromS ? componentEnergy(c, fromS, toS) : componentEnergy(c, 0, usedS))
    const strongest = near.reduce((a, b) => (seen(b) > seen(a) ? b : a))
    const cell = near.filter(c => Math.abs(c.frequencyHz - strongest.frequencyHz) <= 2 / usedS)
    const weightOf = (c: typeof strongest) => 1 / Math.max(c.frequencySdHz ** 2, Number.MIN_VALUE)
    const weights = cell.reduce((sum, c) => sum + weightOf(c), 0)
    const centroidHz = cell.reduce((sum, c) => sum + c.frequencyHz * weightOf(c), 0) / weights
    const centroidDecay = cell.reduce((sum, c) => sum + c.decayDbPerS * weightOf(c), 0) / weights
    const delta = centsBetween(centroidHz, p.frequencyHz)
    const boundCents = (CENTS_PER_LOG * strongest.frequencySdHz) / p.frequencyHz
    const decayDelta = centroidDecay - p.decayDbPerS
    // The decay readings' spread has noise of its own, as the frequencies' does (SPREAD_NOISE).
    const decayPull = decayPullDbPerS(decayDelta, strongest.decaySdDbPerS * SPREAD_NOISE, p.decayBendDbPerS)
    const uncertaintyCents = partialUncertaintyCents(boundCents, delta, p.frequencyHz, p.decayDbPerS, decayPull)
    const uncertaintyDecayPct = partialUncertaintyDecayPct(strongest.decaySdDbPerS, decayDelta, p.decayDbPerS, p.decayBendDbPerS)
    const combined = boundCents * SPREAD_NOISE
    if (Math.abs(delta) > Math.max(WARN_FLOOR_CENTS, COVERAGE * combined)) {
      disagreeing.push([p.frequencyHz, `${p.frequencyHz.toFixed(2)} Hz by ${delta.toFixed(2)} ¢ (±${Math.max(WARN_FLOOR_CENTS, COVERAGE * combined).toFixed(2)} ¢)`])
    }
    return { ...p, crossCheckCents: delta, uncertaintyCents, uncertaintyDecayPct }
  })
  // One sentence for each kind, however many partials: a real strike has dozens, and the Bench
  // shows each warning on its own line.
  const warnings: string[] = []
  if (disagreeing.length > 0) {
    warnings.push(`${partialsPhrase(disagreeing.length)}, the high-resolution estimate differs from the reading by more than the two readings' combined uncertainty allows (its share is in the partial's uncertainty): ${listed(disagreeing)}`)
  }
  if (unchecked.length > 0) {
    warnings.push(`${unchecked.length === 1 ? '1 partial' : `${unchecked.length} partials`} could not be cross-checked by the high-resolution estimator: ${listed(unchecked)}`)
  }
  return { partials: out, warnings }
}

/**
 * A component as it could physically be: its amplitude at most `maxAmplitude`, and its bounds (which
 * fall as 1 / amplitude, dampedSinusoidCrb) scaled up to match.
 */
function physical<C extends BandComponent>(c: C, maxAmplitude: number): C {
  if (!(c.amplitude > maxAmplitude)) return c
  const scale = c.amplitude / maxAmplitude
  return { ...c, amplitude: maxAmplitude, frequencySdHz: c.frequencySdHz * scale, decaySdDbPerS: c.decaySdDbPerS * scale }
}

/** Partials named in one warning, lowest first; the rest are counted (each partial carries its own fields). */
const NAMED_AT_MOST = 10

function listed(items: readonly [number, string][]): string {
  const named = [...items].sort((a, b) => a[0] - b[0]).slice(0, NAMED_AT_MOST).map(([, text]) => text).join(', ')
  return items.length > NAMED_AT_MOST ? `${named} and ${items.length - NAMED_AT_MOST} more` : named
}

function partialsPhrase(count: number): string {
  return count === 1 ? 'At 1 partial' : `At ${count} partials`
}
