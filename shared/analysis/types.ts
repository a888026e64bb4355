import type { PartialDirection, PieceVerdict } from '../records/lists'

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
}

/** One measured partial (a sinusoidal component of the strike). */
export interface MeasuredPartial {
  frequencyHz: number
  /** Peak amplitude of the sinusoid at the onset, dB re full scale (a full-scale sine is 0 dB). */
  amplitudeDb: number
  /** Decay rate of the envelope in dB/s (positive: decaying). */
  decayDbPerS: number
  /** Time to fall by 60 dB, 60 / decayDbPerS, in s; null when not decaying. */
  t60S: number | null
  /** Coefficient of determination of the least-squares line through the dB envelope. */
  r2: number
  startS: number
  endS: number
  /** Standard deviation of the frame frequencies about the partial's frequency, in cents. */
  stabilityCents: number
  /** Beat rate in Hz when the envelope beats or the partial is a close pair; else null. */
  beatHz: number | null
  /** Level above the local noise floor at the strongest frame, in dB. */
  snrDb: number
  /** Number of frames in the track. */
  frames: number
  /** Rate of the envelope's modulation (tremolo or beating), Hz; null where none was measured. */
  modulationHz: number | null
  /** Peak-to-trough depth of that modulation, dB; null where none was measured. */
  modulationDepthDb: number | null
  /** High-resolution (matrix pencil) frequency minus this frequency, in cents; null when the pencil could not measure it. */
  crossCheckCents: number | null
  /** One standard deviation of the frequency, in cents (bound at the measured SNR, span and decay, with the two estimators' spread). */
  uncertaintyCents: number | null
  /** One standard deviation of the decay rate, in % of it; null when not decaying or not measured. */
  uncertaintyDecayPct: number | null
}

/** The new fields that the high-resolution cross-check (annotatePartials) fills in. */
export type CrossCheckFields = 'crossCheckCents' | 'uncertaintyCents' | 'uncertaintyDecayPct'

/** A partial as the FFT path measures it, before the cross-check. */
export type FftPartial = Omit<MeasuredPartial, CrossCheckFields>

/** A template partial matched against the measured partials. */
export interface PartialMatch {
  label: string
  ratio: number
  targetHz: number
  measuredHz: number | null
  /** Deviation used for the verdict: normalised cents when a temperature applies, else raw. */
  cents: number | null
  /** 1200 · log2(measured / target) as measured. */
  rawCents: number | null
  /** Cents normalised to the template's reference temperature; null without a bench temperature. */
  normalizedCents: number | null
  toleranceCents: number
  within: boolean
  missing: boolean
  required: boolean
  direction: PartialDirection | null
  amplitudeDb: number | null
}

export type Verdict = PieceVerdict

/** The JSON contract of one analysis (field names fixed by the issue; extra fields allowed). */
export interface AnalysisResult {
  engineVersion: string
  sampleRate: number
  channels: number
  durationS: number
  onsetS: number
  /** Start and end of the span that was analysed, in s from the start of the file. */
  analysisStartS: number
  analysisEndS: number
  fundamentalHz: number | null
  partials: MeasuredPartial[]
  target?: { fundamentalHz: number, referenceHz: number, note: string | null }
  matches?: PartialMatch[]
  template?: Required<RatioTemplateInput>
  temperatureC?: number | null
  verdict: Verdict | null
  guidance: string[]
  warnings: string[]
  parameters: AnalysisParameters
}

/** Everything needed to reproduce an analysis. */
export interface AnalysisParameters {
  window: 'blackman-harris'
  windowS: number
  zeroPad: number
  hopS: number
  fftSize: number
  attackSkipS: number
  peakThresholdDb: number
  /** Partials weaker than the strongest by more than this (dB) are not reported. */
  dynamicRangeDb: number
  noiseMarginDb: number
  trackJumpCents: number
  minTrackFrames: number
  fitMarginDb: number
  refinement: 'long-window-dtft'
  maxRefineS: number
  windowFrom: 'template' | 'rough-pass' | 'option' | 'default'
  /** The resolutions of the multi-resolution analysis, slowest first (the first is `windowS`). */
  bands: AnalysisBandParameters[]
}

/** One resolution: its window and hop, and the band of frequencies whose partials it measures. */
export interface AnalysisBandParameters {
  windowS: number
  hopS: number
  fromHz: number
  toHz: number
  /** End of the span this band analysed, in s from the start of the file. */
  endS: number
}
