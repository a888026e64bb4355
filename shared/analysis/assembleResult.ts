import { analysisParameters } from './analysisParameters'
import type { StrikeSpan } from './findStrike'
import type { BandMeasurement } from './measureBand'
import type { AnalysisPlan } from './planAnalysis'
import type { AnalysisResult, MeasuredPartial } from './types'
import { ENGINE_VERSION } from './version'

/** What the result says about the file and the analysis, besides the partials. */
export interface ResultContext {
  sampleRate: number
  channels: number
  samples: number
  strike: StrikeSpan
  plan: AnalysisPlan
  measured: readonly BandMeasurement[]
  attackSkipS: number
  dynamicRangeDb: number
}

/**
 * The result before the template is applied: the file, the span, the partials, the
 * warnings and the parameters that reproduce the analysis; no target, verdict or guidance.
 */
export function assembleResult(partials: MeasuredPartial[], notes: Pick<AnalysisResult, 'warnings' | 'advice'>, context: ResultContext): AnalysisResult {
  const { sampleRate, strike, plan } = context
  return {
    engineVersion: ENGINE_VERSION,
    sampleRate,
    channels: context.channels,
    durationS: context.samples / sampleRate,
    onsetS: strike.onsetIndex / sampleRate,
    analysisStartS: strike.startIndex / sampleRate,
    analysisEndS: strike.endIndex / sampleRate,
    fundamentalHz: null,
    partials,
    verdict: null,
    guidance: [],
    warnings: notes.warnings,
    advice: notes.advice,
    parameters: analysisParameters(plan.bands, context.measured, sampleRate, {
      attackSkipS: context.attackSkipS,
      dynamicRangeDb: context.dynamicRangeDb,
      windowFrom: plan.needs.windowFrom,
    }),
  }
}
