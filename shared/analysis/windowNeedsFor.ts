import type { WindowNeeds } from './chooseWindow'
import { roughPartialSpacing } from './roughPartialSpacing'
import type { AnalysisParameters } from './types'

/** What the analysis windows must resolve, and where that came from. */
export interface ResolvedNeeds extends Omit<WindowNeeds, 'spanS' | 'windowS'> {
  windowFrom: AnalysisParameters['windowFrom']
  /** Lists of neighbouring frequencies to keep apart (strong rough-pass peaks; template partials), each ascending, Hz. */
  neighbourLists: number[][]
}

/** Rough-pass peaks weaker than the strongest by more than this (noise, leakage, a room's colour) set no needs, dB. */
const STRONG_DB = 50

/** Lowest partial assumed when the rough pass finds no peak (a gliding drum smears its own), Hz. */
export const DEFAULT_LOWEST_HZ = 100

/**
 * A template's lowest partial above this fraction of the rough pass's lowest peak is that
 * peak (a piece off its target, a drum read during its glide): the window chooseWindow gives
 * the peak still resolves it from DC by over 1.1 main lobes (its margin is 1.25), so it sets
 * no need of its own.
 */
export const SAME_LOWEST_RATIO = 1.1 / 1.25

/**
 * The partials the windows must resolve: those a rough first look at the strike finds and,
 * with a target, the template's expected partials — both, always, so that a target can only
 * add needs (a template never shortens the window below what the sound itself asks for,
 * and the lowest partial is resolved from DC whatever the template holds). Spacing is the
 * smallest distance between neighbours within either list (an expected partial and the
 * peak that is its measurement are no pair); the lowest is the lower of both, where an
 * expected lowest partial just under the rough pass's lowest peak is that peak, and where the
 * rough pass finds nothing, DEFAULT_LOWEST_HZ unless the template expects lower.
 */
export function windowNeedsFor(
  signal: Float64Array,
  sampleRate: number,
  span: { startIndex: number, endIndex: number },
  expectedHz: readonly number[] | null,
  forced: boolean,
): ResolvedNeeds {
  const rough = roughPartialSpacing(signal, sampleRate, span.startIndex, span.endIndex)
  const strong = (rough?.frequenciesHz ?? []).filter((_, i) => rough!.relativeDb[i]! >= -STRONG_DB)
  const expected = [...new Set(expectedHz ?? [])].filter(f => f < sampleRate / 2).sort((a, b) => a - b)
  let spacingHz = Infinity
  for (const list of [strong, expected]) {
    for (let i = 1; i < list.length; i++) spacingHz = Math.min(spacingHz, list[i]! - list[i - 1]!)
  }
  // The default stands when the rough pass saw nothing: a template can lower it, never raise it.
  const roughLowestHz = strong[0] ?? DEFAULT_LOWEST_HZ
  const templateLowestHz = expected[0]
  const lowestHz = templateLowestHz !== undefined && templateLowestHz < SAME_LOWEST_RATIO * roughLowestHz ? templateLowestHz : roughLowestHz
  const windowFrom = forced ? 'option' : expected.length > 0 ? 'template' : rough ? 'rough-pass' : 'default'
  return { spacingHz, lowestHz, neighbourLists: [strong, expected], windowFrom }
}
