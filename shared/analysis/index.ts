// Tonewright measurement engine: partials, decay and cents from one strike.
// Pure TypeScript (no framework imports), shared by the server, scripts and browser.

export { ENGINE_VERSION } from './version'
export { AnalysisError, type AnalysisErrorStatus } from './AnalysisError'
export { LIMITS } from './limits'
export type {
  AnalysisParameters,
  AnalysisResult,
  AnalyzeOptions,
  MeasuredPartial,
  PartialMatch,
  RatioTemplateInput,
  TemplatePartialSpec,
  Verdict,
} from './types'

// Whole pipeline.
export { analyzeStrike } from './analyzeStrike'
export { analyzeSamples } from './analyzeSamples'
export { analyzeChannels } from './analyzeChannels'
export {
  AnalyzeOptionsObjectSchema,
  AnalyzeOptionsSchema,
  RatioTemplateSchema,
  TemplatePartialSpecSchema,
} from './analyzeOptionsSchema'
export { parseAnalyzeOptions, validateAnalyzeOptions } from './parseAnalyzeOptions'

// Pitch.
export { parseNoteName, type NoteName } from './parseNoteName'
export { noteToFrequencyHz } from './noteToFrequencyHz'
export { frequencyToNote, type NearestNote } from './frequencyToNote'
export { centsBetween } from './centsBetween'

// Audio in and out.
export { decodeAudio, checkLimits, type DecodedAudio } from './decodeAudio'
export { readWavHeader, type WavHeader } from './readWavHeader'
export { detectContainer, isLossy, type ContainerKind } from './detectContainer'
export { encodeWav } from './encodeWav'
export { channelSigns, type ChannelSign } from './channelSigns'
export { mixToMono } from './mixToMono'
export { inspectLevels, CLIP_LEVEL, type LevelReport } from './inspectLevels'

// Steps of the pipeline.
export { findStrike, type StrikeSpan, type StrikeSettings } from './findStrike'
export { chooseWindow, MAIN_LOBE_BINS, type WindowChoice, type WindowNeeds } from './chooseWindow'
export { roughPartialSpacing, type RoughPartials } from './roughPartialSpacing'
export { shortTimePeaks, type SpectralPeak, type SpectrumFrame, type ShortTimeSettings } from './shortTimePeaks'
export { linkTracks, type TrackPoint, type LinkSettings } from './linkTracks'
export { measureTrack, type TrackContext, type TrackMeasurement } from './measureTrack'
export { detectBeat, type BeatSettings } from './detectBeat'
export { separatePair, type SeparatedPair } from './separatePair'
export { resolveTarget, type ResolvedTarget } from './resolveTarget'
export { resolveTemplate, defaultPartialLabel, TEMPLATE_DEFAULTS } from './resolveTemplate'
export { matchTemplate } from './matchTemplate'
export { decideVerdict } from './decideVerdict'
export { guidanceLines } from './guidanceLines'

// Numerical building blocks.
export { blackmanHarris, BLACKMAN_HARRIS_COEFFICIENTS } from './blackmanHarris'
export { realFft } from './realFft'
export { directDft } from './directDft'
export { dtftAt, type Complex } from './dtftAt'
export { basebandDtft } from './basebandDtft'
export { bandSource, type BandSource } from './bandSource'
export { decimateBand, type Baseband, type DecimatedBand } from './decimateBand'
export { inputBand } from './inputBand'
export { windowBand } from './windowBand'
export { refinePeak, type RefinedPeak } from './refinePeak'
export { parabolicPeak, type ParabolicVertex } from './parabolicPeak'
export { bandNoiseFloor } from './bandNoiseFloor'
export { selectQuantile } from './selectQuantile'
export { fitLine, type LineFit } from './fitLine'
export { nextPowerOfTwo } from './nextPowerOfTwo'

// High-resolution estimator (matrix pencil), cross-check and per-partial uncertainty.
export { annotatePartials, type AnnotateSettings, type AnnotatedPartials } from './annotatePartials'
export { estimateBand, type BandComponent, type BandEstimate, type BandSettings } from './estimateBand'
export { measureShortPartial, type ShortPartial, type ShortPartialSettings } from './measureShortPartial'
export { separateDoublet, type DoubletSettings } from './separateDoublet'
export { matrixPencil, type ExponentialFit, type PencilSettings } from './matrixPencil'
export { refineExponentials, type RefineSettings } from './refineExponentials'
export { mixDownBand, type BandSignal, type ComplexSignal, type MixDownSettings } from './mixDownBand'
export { kaiserLowPass, type LowPassDesign } from './kaiserLowPass'
export { besselI0 } from './besselI0'
export { selectModelOrder, type ModelOrderLimits } from './selectModelOrder'
export { dampedSinusoidCrb, type DampedSinusoidBound } from './dampedSinusoidCrb'
export type { CrossCheckFields, FftPartial } from './types'
export { solveNormalEquations } from './solveNormalEquations'
