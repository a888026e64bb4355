import { z } from 'zod'
import { PARTIAL_DIRECTIONS, PIECE_VERDICTS } from '../records/lists'

/*
 * The engine's result as JSON, the one source of its types (shared/analysis/types.ts
 * derives them). Stored results are read back through these schemas: fields that an
 * older engine did not write (engine 1 had no cross-check, uncertainty, modulation or
 * bands) read as null or empty, so every row has the current shape.
 */

/** A field added after engine 1: null when an older result does not have it. */
const laterNumber = () => z.number().nullable().default(null)

export const MeasuredPartialSchema = z.object({
  /** On the reference's scale: corrected for the input's clock offset when a calibration was applied. */
  frequencyHz: z.number(),
  /** The frequency as the input read it, before the clock correction; absent when none was applied. */
  rawFrequencyHz: z.number().optional(),
  /** Peak amplitude of the sinusoid at the onset, dB re full scale (a full-scale sine is 0 dB). */
  amplitudeDb: z.number(),
  /** Decay rate of the envelope in dB/s (positive: decaying). */
  decayDbPerS: z.number(),
  /** Time to fall by 60 dB, 60 / decayDbPerS, in s; null when not decaying. */
  t60S: z.number().nullable(),
  /** Coefficient of determination of the least-squares line through the dB envelope. */
  r2: z.number(),
  startS: z.number(),
  endS: z.number(),
  /** Standard deviation of the frame frequencies about the partial's frequency, in cents. */
  stabilityCents: z.number(),
  /** Beat rate in Hz when the envelope beats or the partial is a close pair; else null. */
  beatHz: z.number().nullable(),
  /** Level above the local noise floor at the strongest frame, in dB. */
  snrDb: z.number(),
  /** Number of frames in the track. */
  frames: z.number(),
  /** Rate of the envelope's modulation (tremolo or beating), Hz; null where none was measured. */
  modulationHz: laterNumber(),
  /** Peak-to-trough depth of that modulation, dB; null where none was measured. */
  modulationDepthDb: laterNumber(),
  /** High-resolution (matrix pencil) frequency minus this frequency, in cents; null when the pencil could not measure it. */
  crossCheckCents: laterNumber(),
  /** One standard deviation of the frequency, in cents (bound at the measured SNR, span and decay, with the two estimators' spread). */
  uncertaintyCents: laterNumber(),
  /** One standard deviation of the decay rate, in % of it; null when not decaying or not measured. */
  uncertaintyDecayPct: laterNumber(),
})

export const PartialMatchSchema = z.object({
  label: z.string(),
  ratio: z.number(),
  targetHz: z.number(),
  measuredHz: z.number().nullable(),
  /** Deviation used for the verdict: normalised cents when a temperature applies, else raw. */
  cents: z.number().nullable(),
  /** 1200 · log2(measured / target) as measured. */
  rawCents: z.number().nullable(),
  /** Cents normalised to the template's reference temperature; null without a bench temperature. */
  normalizedCents: z.number().nullable(),
  toleranceCents: z.number(),
  within: z.boolean(),
  missing: z.boolean(),
  required: z.boolean(),
  direction: z.enum(PARTIAL_DIRECTIONS).nullable(),
  amplitudeDb: z.number().nullable(),
})

/** The matches of a stored result, read on their own (lists select only them); null when the result has none. */
export const StoredMatchesSchema = z.array(PartialMatchSchema).nullable().catch(null)

export const VerdictSchema = z.enum(PIECE_VERDICTS)

/** One resolution: its window and hop, and the band of frequencies whose partials it measures. */
export const AnalysisBandParametersSchema = z.object({
  windowS: z.number(),
  hopS: z.number(),
  fromHz: z.number(),
  toHz: z.number(),
  /** End of the span this band analysed, in s from the start of the file. */
  endS: z.number(),
})

/** Everything needed to reproduce an analysis. */
export const AnalysisParametersSchema = z.object({
  window: z.literal('blackman-harris'),
  windowS: z.number(),
  zeroPad: z.number(),
  hopS: z.number(),
  fftSize: z.number(),
  attackSkipS: z.number(),
  peakThresholdDb: z.number(),
  /** Partials weaker than the strongest by more than this (dB) are not reported; null in engine 1 results, which had no such limit. */
  dynamicRangeDb: laterNumber(),
  noiseMarginDb: z.number(),
  trackJumpCents: z.number(),
  minTrackFrames: z.number(),
  fitMarginDb: z.number(),
  refinement: z.literal('long-window-dtft'),
  maxRefineS: z.number(),
  windowFrom: z.enum(['template', 'rough-pass', 'option', 'default']),
  /** The resolutions of the multi-resolution analysis, slowest first (the first is `windowS`); empty in engine 1 results. */
  bands: z.array(AnalysisBandParametersSchema).default([]),
  /** The input's clock offset the frequencies were corrected for, ppm (positive: the input reads high); absent when none. */
  clockOffsetPpm: z.number().optional(),
})

export const TemplatePartialResultSchema = z.object({ label: z.string(), ratio: z.number(), toleranceCents: z.number(), required: z.boolean() })

/** The JSON contract of one analysis (field names fixed by the issue). */
export const AnalysisResultSchema = z.object({
  engineVersion: z.string(),
  sampleRate: z.number(),
  channels: z.number(),
  durationS: z.number(),
  onsetS: z.number(),
  /** Start and end of the span that was analysed, in s from the start of the file. */
  analysisStartS: z.number(),
  analysisEndS: z.number(),
  fundamentalHz: z.number().nullable(),
  partials: z.array(MeasuredPartialSchema),
  target: z.object({ fundamentalHz: z.number(), referenceHz: z.number(), note: z.string().nullable() }).optional(),
  matches: z.array(PartialMatchSchema).optional(),
  template: z.object({
    partials: z.array(TemplatePartialResultSchema),
    searchWindowCents: z.number(),
    referenceTemperatureC: z.number(),
    temperatureCoefficientCentsPerC: z.number(),
  }).optional(),
  temperatureC: z.number().nullable().optional(),
  verdict: VerdictSchema.nullable(),
  guidance: z.array(z.string()),
  warnings: z.array(z.string()),
  /**
   * The warnings about the recording itself and what to do about it (clipping, a second blow,
   * hum, a glide, a recording too short…), in their order: the Bench shows these open and folds
   * the rest, which are about how the measurement went. Empty in results that predate it.
   */
  advice: z.array(z.string()).default([]),
  parameters: AnalysisParametersSchema,
})

/** A result as a row stores it: any engine version's shape. */
export type StoredAnalysis = z.input<typeof AnalysisResultSchema>

/** A stored result in the current shape; a row that is not an analysis at all is an error, never guessed at. */
export function parseStoredAnalysis(stored: unknown) {
  const parsed = AnalysisResultSchema.safeParse(stored)
  if (!parsed.success) throw new Error(`A stored analysis cannot be read: ${parsed.error.issues[0]?.path.join('.')} ${parsed.error.issues[0]?.message}`)
  return parsed.data
}
