import { MAIN_LOBE_BINS } from './chooseWindow'
import { basebandLevels } from './basebandLevels'
import { decayingWindowGain } from './decayingWindowGain'
import { detectBeat } from './detectBeat'
import { dtftPowers3 } from './dtftPowers3'
import { envelopeDepthDb } from './envelopeDepthDb'
import { fitLine } from './fitLine'
import type { TrackPoint } from './linkTracks'
import { measureModulation, type ModulationSettings } from './measureModulation'
import { refinePeak, type RefinedPeak } from './refinePeak'
import { separatePair } from './separatePair'
import type { FftPartial } from './types'
import { windowSpan } from './windowSpan'

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
  /** `signal[start … start + length)` times a Blackman–Harris window, possibly from a cache shared by the tracks. */
  windowed?: (start: number, length: number) => Float64Array
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

/** A measured partial with the length of the span that refined it (for de-duplication). */
export interface TrackMeasurement extends FftPartial {
  refineSpanS: number
  /** Short-time window of the band the track came from, in s. */
  windowS: number
  /** Level of the track's strongest frame, dB re full scale (a lower bound of the onset amplitude). */
  strongestFrameDb: number
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

  const times = fitPoints.map(p => p.timeS)
  // Weights: the inverse noise variance of a frame's level (∝ 10^(SNR/10)), capped at
  // 40 dB over the floor — above that the decay model, not the noise, limits the fit.
  const weights = fitPoints.map(p => 10 ** (Math.min(0, p.amplitudeDb - p.noiseFloorDb - 40) / 10))
  const fit = fitLine(times, fitPoints.map(p => p.amplitudeDb), weights)
  const decayDbPerS = -fit.slope
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
  const alpha = (decayDbPerS * Math.LN10) / 20
  const windowed = context.windowed ? context.windowed(spanStart, length) : windowSpan(signal, spanStart, length, 0, 0).windowed
  const gain = decayingWindowGain(length, alpha / sampleRate, spanStart - context.onsetIndex)
  const binHz = sampleRate / length

  const common = {
    decayDbPerS,
    t60S: decayDbPerS > 0 ? 60 / decayDbPerS : null,
    r2: fit.r2,
    startS: points[0]!.timeS,
    endS: points[points.length - 1]!.timeS,
    stabilityCents,
    snrDb: bestSnr,
    frames: points.length,
    refineSpanS: length / sampleRate,
    windowS: context.windowLength / sampleRate,
    strongestFrameDb,
  }
  const amplitudeDb = (magnitude: number) => 20 * Math.log10(Math.max((2 * magnitude) / gain, 1e-12))

  // The one-bin step first: a reading far under the reporting floor stops there — unless its
  // envelope beats, when a pair's separated onset levels may stand far over the peak's.
  const rough = refinePeak(windowed, sampleRate, coarseHz, [1])
  if (envelopeBeatHz === null && amplitudeDb(rough.magnitude) < (context.reportFloorDb ?? -Infinity) - BELOW_FLOOR_MARGIN_DB) {
    return [plain(rough)]
  }
  const peak = refinePeak(windowed, sampleRate, rough.frequencyHz, [0.1])
  // Sidebands down to maxBelowCarrierDb need the partial that far over the noise, and 10 dB more.
  const modulation = bestSnr >= context.modulation.maxBelowCarrierDb + 10
    ? measureModulation(windowed, sampleRate, peak.frequencyHz, context.modulation)
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
    const pair = findClosePair(windowed, sampleRate, coarseHz, ((MAIN_LOBE_BINS / 2) * sampleRate) / context.windowLength, binHz)
    const mirrored = pair ? mirroredSideband(windowed, sampleRate, pair) : null
    if (mirrored) {
      return [{
        ...common,
        frequencyHz: mirrored.carrier.frequencyHz,
        amplitudeDb: amplitudeDb(mirrored.carrier.magnitude),
        beatHz: envelopeBeatHz,
        modulationHz: mirrored.rateHz,
        modulationDepthDb: mirrored.depthDb,
        modulationFrom: 'sidebands' as const,
      }]
    }
    if (pair) {
      const beatHz = Math.abs(pair[1].frequencyHz - pair[0].frequencyHz)
      const separated = separatePair(signal, sampleRate, spanStart, spanEnd, context.onsetIndex, pair[0].frequencyHz, pair[1].frequencyHz, windowed)
      const linear = separated ? separated.amplitude : [2 * pair[0].magnitude / gain, 2 * pair[1].magnitude / gain]
      // Two partials beat between A₁ + A₂ and |A₁ − A₂|.
      const depth = 20 * Math.log10((linear[0]! + linear[1]!) / Math.max(Math.abs(linear[0]! - linear[1]!), 1e-12))
      const modulationFields = { modulationHz: beatHz, modulationDepthDb: Math.min(depth, 60), modulationFrom: 'pair' as const }
      return pair.map((peakK, k) => {
        if (!separated) return { ...common, ...modulationFields, frequencyHz: peakK.frequencyHz, amplitudeDb: amplitudeDb(peakK.magnitude), beatHz }
        const decay = separated.decayDbPerS[k]!
        return {
          ...common,
          ...modulationFields,
          frequencyHz: peakK.frequencyHz,
          amplitudeDb: 20 * Math.log10(Math.max(separated.amplitude[k]!, 1e-12)),
          decayDbPerS: decay,
          t60S: decay > 0 ? 60 / decay : null,
          r2: separated.r2[k]!,
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
 * A close pair that is a carrier and one sideband of a tremolo: the spectrum at the
 * carrier's other side, mirrored, is within 10 dB of the first sideband (a second partial
 * leaves only its partner's skirt there). Returns the carrier, the rate and the depth
 * 20·log10((1 + m)/(1 − m)) with m = (S₋ + S₊)/C, or null for a true pair.
 */
function mirroredSideband(windowed: Float64Array, sampleRate: number, pair: [RefinedPeak, RefinedPeak]) {
  const [carrier, side] = pair[0].magnitude >= pair[1].magnitude ? pair : [pair[1], pair[0]]
  const mirrorHz = 2 * carrier.frequencyHz - side.frequencyHz
  const [mirrorPower] = dtftPowers3(windowed, mirrorHz, carrier.frequencyHz, side.frequencyHz, sampleRate)
  const mirror = Math.sqrt(mirrorPower)
  if (!(mirror > side.magnitude * 10 ** (-10 / 20))) return null
  const index = Math.min(0.98, (mirror + side.magnitude) / carrier.magnitude)
  return { carrier, rateHz: Math.abs(side.frequencyHz - carrier.frequencyHz), depthDb: 20 * Math.log10((1 + index) / (1 - index)) }
}

/**
 * Two local maxima of the long-window magnitude within ±`halfWidthHz` of `centreHz`
 * (a grid of half bins, then refined), the weaker no more than 30 dB under the
 * stronger and the two at least 0.9 half main lobes apart; null otherwise.
 */
function findClosePair(windowed: Float64Array, sampleRate: number, centreHz: number, halfWidthHz: number, binHz: number) {
  const step = binHz / 2
  const grid = basebandLevels(windowed, sampleRate, centreHz, Math.max(3 * step, halfWidthHz), step)
  const count = (grid.length - 1) / 2
  const levels = Array.from(grid)
  const maxima: { index: number, level: number }[] = []
  for (let i = 1; i < levels.length - 1; i++) {
    if (levels[i]! > levels[i - 1]! && levels[i]! >= levels[i + 1]!) maxima.push({ index: i, level: levels[i]! })
  }
  if (maxima.length < 2) return null
  maxima.sort((a, b) => b.level - a.level)
  const [first, second] = maxima as [(typeof maxima)[0], (typeof maxima)[0]]
  if (second.level < first.level - 30) return null
  const refined = [first, second]
    .map(m => refinePeak(windowed, sampleRate, centreHz + (m.index - count) * step, [0.25, 0.1]))
    .sort((a, b) => a.frequencyHz - b.frequencyHz) as [ReturnType<typeof refinePeak>, ReturnType<typeof refinePeak>]
  // Closer than 3.6 bins (0.9 × the half main lobe) the window cannot resolve the pair:
  // two maxima there come from the beating itself, not from two separable partials.
  if (refined[1].frequencyHz - refined[0].frequencyHz < 0.9 * (MAIN_LOBE_BINS / 2) * binHz) return null
  return refined
}
