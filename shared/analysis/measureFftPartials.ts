import { bandSource, type BandSource } from './bandSource'
import { dropDuplicates } from './dropDuplicates'
import { dropSidebands } from './dropSidebands'
import { dropSpuriousPartials } from './dropSpuriousPartials'
import { ENGINE_SETTINGS as S } from './engineSettings'
import type { StrikeSpan } from './findStrike'
import { findMainsHum, mainsHumWarning } from './findMainsHum'
import { guardPartials } from './guardPartials'
import { lookForGlide } from './lookForGlide'
import { dropPairsOnGlide, pitchGlideWarning, type PitchGlide } from './findPitchGlide'
import { measureAllBands } from './measureAllBands'
import { quantisationRangeDb } from './quantisationRangeDb'
import type { BandMeasurement } from './measureBand'
import type { TrackMeasurement } from './measureTrack'
import type { AnalysisPlan } from './planAnalysis'
import { reportFloor } from './reportFloor'
import type { DoubletCandidate } from './splitDoublets'

/** The FFT path's partials within the reported range, and how they were measured. */
export interface FftPartials {
  partials: DoubletCandidate[]
  measured: BandMeasurement[]
  /** Floor of the reported range (strongest − dynamic range), dB re full scale. */
  minAmplitudeDb: number
  dynamicRangeDb: number
  warnings: string[]
  /** What the recording would need, or what the benchmaker should know of it (a glide, a span too short). */
  advice: string[]
  /** Where the loudest sound glides in pitch, if it does. */
  glide: PitchGlide | null
}

/**
 * Every band measured and merged (measureAllBands), readings outside the physical bounds
 * left out (guardPartials), then the reported range (within `dynamicRangeDb` of the
 * strongest: 80 dB, 35 for a lossy codec, less for coarse PCM by quantisationRangeDb — judged at
 * its strongest frame where the format sets the range), modulation sidebands, duplicates and spurious tracks left out.
 */
export function measureFftPartials(
  mono: Float64Array,
  sampleRate: number,
  strike: StrikeSpan,
  plan: AnalysisPlan,
  level: { peakDb: number, lossy: boolean, pcmBits?: number | null },
  /** Decimated bands of `mono` (bandSource), shared with later steps. */
  bands: BandSource = bandSource(mono, sampleRate),
): FftPartials {
  const bounds = {
    peakDb: level.peakDb,
    peakMarginDb: S.peakMarginDb,
    sampleRate,
    minFrequencyHz: plan.range.minHz,
    spanS: (strike.endIndex - strike.startIndex) / sampleRate,
    maxDecayDbPerS: S.maxDecayDbPerS,
    maxGrowthDbPerS: S.maxGrowthDbPerS,
  }
  const dynamicRangeDb = level.lossy
    ? S.lossyRangeDb
    : Math.round(Math.min(S.peakThresholdDb, level.pcmBits ? quantisationRangeDb(level.pcmBits) : Infinity))
  const { measured, merged } = measureAllBands(mono, sampleRate, strike, plan.bands, S, reportFloor(bounds, dynamicRangeDb), bands)
  const guarded = guardPartials(merged, bounds)
  const strongestDb = Math.max(-Infinity, ...guarded.kept.map(m => m.amplitudeDb))
  const minAmplitudeDb = strongestDb - dynamicRangeDb
  // A codec's noise, and coarse PCM's quantisation error, rise against the strike in its quiet
  // tail; read back to the blow at its own decay such a line would pass for a loud partial (an
  // 8-bit file's 5.5 kHz error line, seen at −68 dB 1.4 s on, read −40 dB at the blow), so where the
  // format sets the range, readings are judged where they were seen.
  const formatLimited = level.lossy || dynamicRangeDb < S.peakThresholdDb
  const seenDb = (m: TrackMeasurement) => formatLimited ? Math.min(m.amplitudeDb, m.strongestFrameDb) : m.amplitudeDb
  const candidates = dropDuplicates(dropSidebands(guarded.kept.filter(m => seenDb(m) >= minAmplitudeDb)))
  // Hum is named whether or not its lines are left out as steady lines far under the strike.
  const hum = findMainsHum(candidates)
  const honest = dropSpuriousPartials(candidates, { strongestDb, ...S.spurious, humLinesHz: hum?.linesHz })
  const read = honest.kept.map(({ refineSpanS: _span, strongestFrameDb: _frame, ...p }): DoubletCandidate => p)
  const glide = lookForGlide(mono, sampleRate, strike, { frames: measured[0]!.frames, windowS: plan.bands[0]!.windowS }, read, plan.range)
  const partials = dropPairsOnGlide(read, glide)
  const glideWarning = pitchGlideWarning(glide, partials.map(p => p.frequencyHz))
  return { partials, measured, minAmplitudeDb, dynamicRangeDb, warnings: [...guarded.warnings, ...honest.warnings], advice: [...guarded.advice, ...[mainsHumWarning(hum), glideWarning].filter(w => w !== null)], glide }
}
