import { MAIN_LOBE_BINS } from './chooseWindow'
import { detectBeat } from './detectBeat'
import { dtftPowers3 } from './dtftPowers3'
import { fitLine } from './fitLine'
import type { TrackPoint } from './linkTracks'
import { refinePeak } from './refinePeak'
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
}

/** A measured partial with the length of the span that refined it (for de-duplication). */
export interface TrackMeasurement extends FftPartial {
  refineSpanS: number
}

/**
 * Measure one partial track: decay rate (dB/s) by a weighted least-squares line through
 * the dB envelope of the frames well above the noise floor (T60 = 60 / rate), beating from
 * the fit's residual, then frequency and onset amplitude from one long Blackman–Harris
 * window over the track's span. The amplitude divides |X(f)| by Σ w[n]·e^{−α(t_n − t_onset)},
 * the gain of the window for a partial decaying at the fitted rate α (Np/s), which gives
 * the sinusoid's amplitude at the onset directly. When the envelope beats, the long
 * spectrum around the track is scanned for a close pair, which is reported as two partials
 * whose envelopes are separated by separatePair.
 * Returns zero, one or two partials.
 */
export function measureTrack(points: TrackPoint[], signal: Float64Array, sampleRate: number, context: TrackContext): TrackMeasurement[] {
  let bestSnr = -Infinity
  for (const p of points) bestSnr = Math.max(bestSnr, p.amplitudeDb - p.noiseFloorDb)
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
  const { windowed, decayingGain: gain } = windowSpan(signal, spanStart, length, alpha / sampleRate, context.onsetIndex)
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
  }
  const amplitudeDb = (magnitude: number) => 20 * Math.log10(Math.max((2 * magnitude) / gain, 1e-12))

  if (envelopeBeatHz !== null) {
    const pair = findClosePair(windowed, sampleRate, coarseHz, ((MAIN_LOBE_BINS / 2) * sampleRate) / context.windowLength, binHz)
    if (pair) {
      const beatHz = Math.abs(pair[1].frequencyHz - pair[0].frequencyHz)
      const separated = separatePair(signal, sampleRate, spanStart, spanEnd, context.onsetIndex, pair[0].frequencyHz, pair[1].frequencyHz)
      return pair.map((peak, k) => {
        if (!separated) return { ...common, frequencyHz: peak.frequencyHz, amplitudeDb: amplitudeDb(peak.magnitude), beatHz }
        const decay = separated.decayDbPerS[k]!
        return {
          ...common,
          frequencyHz: peak.frequencyHz,
          amplitudeDb: 20 * Math.log10(Math.max(separated.amplitude[k]!, 1e-12)),
          decayDbPerS: decay,
          t60S: decay > 0 ? 60 / decay : null,
          r2: separated.r2[k]!,
          beatHz,
        }
      })
    }
  }
  const peak = refinePeak(windowed, sampleRate, coarseHz)
  return [{ ...common, frequencyHz: peak.frequencyHz, amplitudeDb: amplitudeDb(peak.magnitude), beatHz: envelopeBeatHz }]
}

/**
 * Two local maxima of the long-window magnitude within ±`halfWidthHz` of `centreHz`
 * (a grid of half bins, then refined), the weaker no more than 30 dB under the
 * stronger and the two at least 0.9 half main lobes apart; null otherwise.
 */
function findClosePair(windowed: Float64Array, sampleRate: number, centreHz: number, halfWidthHz: number, binHz: number) {
  const step = binHz / 2
  const count = Math.max(3, Math.ceil(halfWidthHz / step))
  const levels: number[] = []
  for (let i = -count; i <= count; i += 3) {
    const powers = dtftPowers3(windowed, centreHz + i * step, centreHz + (i + 1) * step, centreHz + (i + 2) * step, sampleRate)
    for (const p of powers) levels.push(10 * Math.log10(p + Number.MIN_VALUE))
  }
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
