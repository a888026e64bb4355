import { MAIN_LOBE_BINS } from './chooseWindow'
import { bandSource, type BandSource } from './bandSource'
import { decayingWindowGain } from './decayingWindowGain'
import { findDecayKnee } from './findDecayKnee'
import { detectBeat } from './detectBeat'
import { envelopeDepthDb } from './envelopeDepthDb'
import { findClosePair } from './findClosePair'
import { fitLine } from './fitLine'
import type { TrackPoint } from './linkTracks'
import { measureModulation, type ModulationSettings } from './measureModulation'
import { mirroredSideband } from './mirroredSideband'
import { refinePeak, type RefinedPeak } from './refinePeak'
import { separatePair } from './separatePair'
import type { FftPartial } from './types'
import { windowBand } from './windowBand'
import { DB_PER_NEPER } from './units'
import { decayBendDbPerS } from './decayBend'

export interface TrackContext {
  onsetIndex: number
  /** First and one-past-last sample that may be used. */
  startIndex: number
  endIndex: number
  /** Length of the short-time window the track came from, in samples. */
  windowLength: number
  /** Only frames this far over the noise floor enter the decay fit, in dB. */
  fitMarginDb: number
  /** A track must reach this far over the noise floor somewhere, in dB. */
  minSnrDb: number
  /** Longest span used for the frequency refinement, in s. */
  maxRefineS: number
  modulation: ModulationSettings
  /** Decimated bands of `signal`, shared by the tracks of one analysis (made for this track alone when absent). */
  bands?: BandSource
  /** Floor of the reported range as known so far (reportFloor), dB re full scale. */
  reportFloorDb?: number
}

/**
 * A reading this far under the reporting floor after the first, one-bin refinement step
 * is not refined further nor searched for sidebands or a pair: it will not be reported.
 * The fine step moves the level by a fraction of a dB; the margin also covers a floor
 * that a later band lowers.
 */
export const BELOW_FLOOR_MARGIN_DB = 12

/** Band samples a long span holds at the least (the long window's lobes then stand clear of the band's edges). */
const MIN_SPAN_SAMPLES = 64

/** A measured partial with the length of the span that refined it (for de-duplication). */
export interface TrackMeasurement extends FftPartial {
  refineSpanS: number
  /** Short-time window of the band the track came from, in s. */
  windowS: number
  /** Level of the track's strongest frame, dB re full scale (a lower bound of the onset amplitude). */
  strongestFrameDb: number
  /** How far the frames' decay curve bends from the line (decayBendDbPerS): a share of the decay's uncertainty. */
  decayBendDbPerS: number
  /** Where the modulation fields came from: symmetric sidebands, a resolved pair, the envelope alone. */
  modulationFrom: 'sidebands' | 'pair' | 'envelope' | null
}

/**
 * Measure one partial track: decay rate (dB/s) by a weighted least-squares line through
 * the dB envelope of the frames well above the noise floor (T60 = 60 / rate), beating from
 * the fit's residual, then frequency and onset amplitude from one long Blackman–Harris
 * window over the track's span. The amplitude divides |X(f)| by Σ w[n]·e^{−α(t_n − t_onset)},
 * the gain of the window for a partial decaying at the fitted rate α (Np/s), which gives
 * the sinusoid's amplitude at the onset directly. When the envelope beats, the long
 * spectrum around the track is scanned for a close pair, which is reported as two partials
 * whose envelopes are separated by separatePair — unless the spectrum shows a symmetric pair
 * of sidebands around the partial (measureModulation): then it is one partial with a tremolo,
 * its sidebands are no partials, and its rate and depth are reported.
 * Returns zero, one or two partials.
 */
export function measureTrack(points: TrackPoint[], signal: Float64Array, sampleRate: number, context: TrackContext): TrackMeasurement[] {
  let bestSnr = -Infinity
  let strongestFrameDb = -Infinity
  for (const p of points) {
    bestSnr = Math.max(bestSnr, p.amplitudeDb - p.noiseFloorDb)
    strongestFrameDb = Math.max(strongestFrameDb, p.amplitudeDb)
  }
  if (bestSnr < context.minSnrDb) return []
  let fitPoints = points.filter(p => p.amplitudeDb - p.noiseFloorDb >= context.fitMarginDb)
  if (fitPoints.length < 3) fitPoints = points.filter(p => p.amplitudeDb - p.noiseFloorDb >= 6)
  if (fitPoints.length < 3) return []

  // Weights: the inverse noise variance of a frame's level (∝ 10^(SNR/10)), capped at
  // 40 dB over the floor — above that the decay model, not the noise, limits the fit.
  const weightOf = (p: TrackPoint) => 10 ** (Math.min(0, p.amplitudeDb - p.noiseFloorDb - 40) / 10)
  // A short-lived partial's own sound dies under a room's slower tail of it: its first stage is the partial.
  const knee = findDecayKnee(fitPoints.map(p => p.timeS), fitPoints.map(p => p.amplitudeDb), fitPoints.map(weightOf))
  if (knee !== null) fitPoints = fitPoints.slice(0, knee)
  const times = fitPoints.map(p => p.timeS)
  const weights = fitPoints.map(weightOf)
  const levels = fitPoints.map(p => p.amplitudeDb)
  const fit = fitLine(times, levels, weights)
  const decayDbPerS = -fit.slope
  const bendDbPerS = decayBendDbPerS(times, levels, weights)
  const frequencies = fitPoints.map(p => p.frequencyHz).sort((a, b) => a - b)
  const coarseHz = frequencies[frequencies.length >> 1]!
  let sumSq = 0
  for (const f of frequencies) sumSq += (1200 * Math.log2(f / coarseHz)) ** 2
  const stabilityCents = Math.sqrt(sumSq / frequencies.length)
  const envelopeBeatHz = detectBeat(times, fit.residuals, { minRmsDb: 0.5, minShare: 0.4 })

  // Long window: from the first to the last fitted frame, best part first if capped.
  const half = context.windowLength / 2
  const spanStart = Math.max(context.startIndex, Math.round(times[0]! * sampleRate - half))
  const spanEnd = Math.min(
    context.endIndex,
    Math.round(times[times.length - 1]! * sampleRate + half),
    spanStart + Math.round(context.maxRefineS * sampleRate),
  )
  const length = spanEnd - spanStart
  if (length < 32) return []
  const alpha = decayDbPerS / DB_PER_NEPER
  const binHz = sampleRate / length
  // Everything below reads a band around the track, mixed down and decimated: as wide as the
  // sidebands reach plus a main lobe of the long window; a beating track's pair search (and
  // its mirror, 3 × its half-width) gets a wider one.
  const pairHalfWidthHz = Math.max(1.5 * binHz, ((MAIN_LOBE_BINS / 2) * sampleRate) / context.windowLength)
  const marginHz = MAIN_LOBE_BINS * binHz
  const maxFactor = Math.max(1, Math.floor(length / MIN_SPAN_SAMPLES))
  const bands = context.bands ?? bandSource(signal, sampleRate)
  const band = bands(coarseHz, context.modulation.maxRateHz + 1 + marginHz, maxFactor, spanStart, length)
  const windowed = windowBand(band, spanStart, length)
  // The band's sums are 1/factor of the input's: so is the window's gain.
  const gain = decayingWindowGain(length, alpha / sampleRate, spanStart - context.onsetIndex) / band.factor

  const common = {
    decayDbPerS,
    t60S: decayDbPerS > 0 ? 60 / decayDbPerS : null,
    r2: fit.r2,
    startS: points[0]!.timeS,
    // Past a knee the track is the room's tail of the partial, not the partial.
    endS: (knee === null ? points[points.length - 1]! : fitPoints[fitPoints.length - 1]!).timeS,
    stabilityCents,
    snrDb: bestSnr,
    frames: points.length,
    refineSpanS: length / sampleRate,
    windowS: context.windowLength / sampleRate,
    strongestFrameDb,
    decayBendDbPerS: bendDbPerS,
  }
  const amplitudeDb = (magnitude: number) => 20 * Math.log10(Math.max((2 * magnitude) / gain, 1e-12))

  // The one-bin step first: a reading far under the reporting floor stops there — unless its
  // envelope beats, when a pair's separated onset levels may stand far over the peak's.
  const rough = refinePeak(windowed, coarseHz, [1])
  if (envelopeBeatHz === null && amplitudeDb(rough.magnitude) < (context.reportFloorDb ?? -Infinity) - BELOW_FLOOR_MARGIN_DB) {
    return [plain(rough)]
  }
  const peak = refinePeak(windowed, rough.frequencyHz, [0.1])
  // Sidebands down to maxBelowCarrierDb need the partial that far over the noise, and 10 dB more.
  const modulation = bestSnr >= context.modulation.maxBelowCarrierDb + 10
    ? measureModulation(windowed, peak.frequencyHz, context.modulation)
    : null
  if (modulation) {
    return [{
      ...common,
      frequencyHz: peak.frequencyHz,
      amplitudeDb: amplitudeDb(peak.magnitude),
      beatHz: envelopeBeatHz,
      modulationHz: modulation.rateHz,
      modulationDepthDb: modulation.depthDb,
      modulationFrom: 'sidebands' as const,
    }]
  }
  if (envelopeBeatHz !== null) {
    const wideBand = bands(coarseHz, 3 * pairHalfWidthHz + marginHz, maxFactor, spanStart, length)
    const wide = wideBand === band ? windowed : windowBand(wideBand, spanStart, length)
    // A band's sums are 1/factor of the input's: readings on the wide band in the narrow one's terms.
    const toNarrow = wideBand.factor / band.factor
    const pair = findClosePair(wide, coarseHz, pairHalfWidthHz, binHz)
    const mirrored = pair ? mirroredSideband(wide, pair) : null
    if (mirrored) {
      return [{
        ...common,
        frequencyHz: mirrored.carrier.frequencyHz,
        amplitudeDb: amplitudeDb(mirrored.carrier.magnitude * toNarrow),
        beatHz: envelopeBeatHz,
        modulationHz: mirrored.rateHz,
        modulationDepthDb: mirrored.depthDb,
        modulationFrom: 'sidebands' as const,
      }]
    }
    if (pair) {
      const beatHz = Math.abs(pair[1].frequencyHz - pair[0].frequencyHz)
      const separated = separatePairOnBand(bands, coarseHz, 3 * pairHalfWidthHz + marginHz, spanStart, length, context.onsetIndex, pair, sampleRate)
      const linear = separated ? separated.amplitude : [2 * pair[0].magnitude * toNarrow / gain, 2 * pair[1].magnitude * toNarrow / gain]
      // Two partials beat between A₁ + A₂ and |A₁ − A₂|.
      const depth = 20 * Math.log10((linear[0]! + linear[1]!) / Math.max(Math.abs(linear[0]! - linear[1]!), 1e-12))
      const modulationFields = { modulationHz: beatHz, modulationDepthDb: Math.min(depth, 60), modulationFrom: 'pair' as const }
      return pair.map((peakK, k) => {
        if (!separated) return { ...common, ...modulationFields, frequencyHz: peakK.frequencyHz, amplitudeDb: amplitudeDb(peakK.magnitude * toNarrow), beatHz }
        const decay = separated.decayDbPerS[k]!
        return {
          ...common,
          ...modulationFields,
          frequencyHz: peakK.frequencyHz,
          amplitudeDb: 20 * Math.log10(Math.max(separated.amplitude[k]!, 1e-12)),
          decayDbPerS: decay,
          t60S: decay > 0 ? 60 / decay : null,
          r2: separated.r2[k]!,
          // The pair's own decays come from separatePair, not the track's line.
          decayBendDbPerS: 0,
          beatHz,
        }
      })
    }
  }
  return [plain(peak)]

  /** One partial at the peak, with the envelope's modulation if it beats. */
  function plain(at: RefinedPeak): TrackMeasurement {
    return {
      ...common,
      frequencyHz: at.frequencyHz,
      amplitudeDb: amplitudeDb(at.magnitude),
      beatHz: envelopeBeatHz,
      modulationHz: envelopeBeatHz,
      modulationDepthDb: envelopeBeatHz === null ? null : envelopeDepthDb(times, fit.residuals, envelopeBeatHz),
      modulationFrom: envelopeBeatHz === null ? null : 'envelope' as const,
    }
  }
}

/**
 * separatePair on the track's span, at a band whose frames of 2.5 beats hold at least 16
 * samples (a narrower band than the refinement's would leave them too few).
 */
function separatePairOnBand(bands: BandSource, centreHz: number, reachHz: number, startIndex: number, length: number, onsetIndex: number, pair: [RefinedPeak, RefinedPeak], sampleRate: number) {
  const beatHz = pair[1].frequencyHz - pair[0].frequencyHz
  const frameLength = Math.min((2.5 / beatHz) * sampleRate, length / 1.5)
  if (frameLength < 64) return null
  const band = bands(centreHz, reachHz, Math.max(1, Math.floor(frameLength / 16)), startIndex, length)
  const at = (index: number) => (index - band.firstIndex) / band.factor
  return separatePair(band, at(startIndex), Math.floor(at(startIndex + length)), at(onsetIndex), pair[0].frequencyHz, pair[1].frequencyHz)
}
