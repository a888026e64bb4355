import { chooseWindow } from './chooseWindow'
import { ENGINE_SETTINGS as S } from './engineSettings'
import type { StrikeSpan } from './findStrike'
import { planBands, type AnalysisBand } from './planBands'
import { windowNeedsFor, type ResolvedNeeds } from './windowNeedsFor'

/** The windows of one analysis: what they must resolve and the bands that follow from it. */
export interface AnalysisPlan {
  needs: ResolvedNeeds
  /** Slowest (the long window) first. */
  bands: AnalysisBand[]
  /** Frequencies the analysis covers, Hz. */
  range: { minHz: number, maxHz: number }
}

/**
 * Window needs from the rough pass and the template (windowNeedsFor), the long window
 * (chooseWindow) and the multi-resolution bands (planBands); a forced window
 * (`windowS`) gets no faster bands.
 */
export function planAnalysis(
  mono: Float64Array,
  sampleRate: number,
  strike: StrikeSpan,
  expectedHz: readonly number[] | null,
  windowS: number | undefined,
): AnalysisPlan {
  const spanS = (strike.endIndex - strike.startIndex) / sampleRate
  const needs = windowNeedsFor(mono, sampleRate, strike, expectedHz, windowS !== undefined)
  const long = chooseWindow({ spacingHz: needs.spacingHz, lowestHz: needs.lowestHz, spanS, windowS }, sampleRate)
  const range = { minHz: 20, maxHz: Math.min(20000, 0.475 * sampleRate) }
  const bands = windowS !== undefined
    ? planBands(long, [], sampleRate, strike, range, { ...S, shortestWindowS: Infinity })
    : planBands(long, needs.neighbourLists, sampleRate, strike, range, S)
  return { needs, bands, range }
}
