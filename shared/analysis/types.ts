import type { z } from 'zod'
import type { AnalysisBandParametersSchema, AnalysisParametersSchema, AnalysisResultSchema, MeasuredPartialSchema, PartialMatchSchema, VerdictSchema } from '../schemas/analysis'

// The result's types come from its zod schemas (shared/schemas/analysis.ts), which also read stored results back.

/** One template partial: a target ratio to the fundamental with its tolerance. */
export interface TemplatePartialSpec {
  label: string
  /** Target frequency divided by the target fundamental (1 for the fundamental). */
  ratio: number
  /** Half-width of the tolerance band in cents (within when |cents| ≤ toleranceCents). */
  toleranceCents: number
  /** A required partial decides the verdict; others are reported only. */
  required: boolean
}

/** A ratio template as the engine uses it (a stored template can be passed as is). */
export interface RatioTemplateInput {
  partials: TemplatePartialSpec[]
  /** Half-width of the search window around ratio × target, in cents. */
  searchWindowCents?: number
  /** Temperature, in °C, at which the template's ratios and the target are meant. */
  referenceTemperatureC?: number
  /** Drift of the pitch with temperature, in cents per °C (negative: flatter when warmer). */
  temperatureCoefficientCentsPerC?: number
}

/** Options of one analysis. All optional; without a target only partials are reported. */
export interface AnalyzeOptions {
  /** Target note in scientific pitch notation, e.g. `C4`. */
  note?: string
  /** Target fundamental in Hz; wins over `note` when both are given. */
  targetHz?: number
  /** A4 reference pitch in Hz for `note` (400–480, default 440). */
  referenceHz?: number
  ratios?: number[]
  tolerances?: number[]
  labels?: string[]
  required?: boolean[]
  searchWindowCents?: number
  referenceTemperatureC?: number
  temperatureCoefficientCentsPerC?: number
  /** Bench temperature in °C when the strike was recorded. */
  temperatureC?: number
  /** A whole template; wins over ratios/tolerances/labels/required. */
  template?: RatioTemplateInput
  /** Time skipped after the onset to leave out the attack transient, in s (default 0.005). */
  attackSkipS?: number
  /** Force the analysis window length in s instead of deriving it. */
  windowS?: number
  /** Clock offset of the input that recorded the strike, ppm (positive: reads high); frequencies are corrected for it. */
  clockOffsetPpm?: number
}

/** One measured partial (a sinusoidal component of the strike); fields documented in its schema. */
export type MeasuredPartial = z.output<typeof MeasuredPartialSchema>

/** The new fields that the high-resolution cross-check (annotatePartials) fills in. */
export type CrossCheckFields = 'crossCheckCents' | 'uncertaintyCents' | 'uncertaintyDecayPct'

/** A partial as the FFT path measures it, before the cross-check. */
export type FftPartial = Omit<MeasuredPartial, CrossCheckFields>

/** A template partial matched against the measured partials. */
export type PartialMatch = z.output<typeof PartialMatchSchema>

export type Verdict = z.output<typeof VerdictSchema>

/** The JSON contract of one analysis (field names fixed by the issue). */
export type AnalysisResult = z.output<typeof AnalysisResultSchema>

/** Everything needed to reproduce an analysis. */
export type AnalysisParameters = z.output<typeof AnalysisParametersSchema>

/** One resolution: its window and hop, and the band of frequencies whose partials it measures. */
export type AnalysisBandParameters = z.output<typeof AnalysisBandParametersSchema>
