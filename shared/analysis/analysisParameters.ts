import type { BandMeasurement } from './measureBand'
import type { AnalysisBand } from './planBands'
import { ENGINE_SETTINGS } from './engineSettings'
import type { AnalysisParameters } from './types'

/** The `parameters` of a result: everything needed to reproduce the analysis. */
export function analysisParameters(
  bands: readonly AnalysisBand[],
  measured: readonly BandMeasurement[],
  sampleRate: number,
  extra: { attackSkipS: number, dynamicRangeDb: number, windowFrom: AnalysisParameters['windowFrom'] },
): AnalysisParameters {
  const long = bands[0]!
  const S = ENGINE_SETTINGS
  return {
    window: 'blackman-harris',
    windowS: long.windowS,
    zeroPad: long.zeroPad,
    hopS: long.hopS,
    fftSize: long.fftSize,
    attackSkipS: extra.attackSkipS,
    peakThresholdDb: S.peakThresholdDb,
    dynamicRangeDb: extra.dynamicRangeDb,
    noiseMarginDb: S.noiseMarginDb,
    trackJumpCents: measured[0]!.trackJumpCents,
    minTrackFrames: measured[0]!.minTrackFrames,
    fitMarginDb: S.fitMarginDb,
    refinement: 'long-window-dtft',
    maxRefineS: S.maxRefineS,
    windowFrom: extra.windowFrom,
    bands: bands.map(b => ({ windowS: b.windowS, hopS: b.hopS, fromHz: b.ownFromHz, toHz: b.toHz, endS: b.endIndex / sampleRate })),
  }
}
