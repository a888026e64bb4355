import { analyzeChannels } from './analyzeChannels'
import type { AnalysisResult, AnalyzeOptions } from './types'

/**
 * Measure one strike from already decoded mono samples (full scale ±1) at `sampleRate`
 * Hz. Same pipeline and result as analyzeStrike, without the decoding step.
 * Throws AnalysisError on audio that cannot be measured or on bad options.
 */
export function analyzeSamples(
  samples: Float32Array | Float64Array,
  sampleRate: number,
  options: AnalyzeOptions = {},
): AnalysisResult {
  return analyzeChannels([samples], sampleRate, options)
}
