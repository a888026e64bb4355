import type { WindowNeeds } from './chooseWindow'
import { roughPartialSpacing } from './roughPartialSpacing'
import type { AnalysisParameters } from './types'

/** What the analysis windows must resolve, and where that came from. */
export interface ResolvedNeeds extends Omit<WindowNeeds, 'spanS' | 'windowS'> {
  windowFrom: AnalysisParameters['windowFrom']
  /** Frequencies known to matter (rough-pass peaks within 40 dB of the strongest, template partials), ascending, Hz. */
  knownHz: number[]
}

/**
 * The partials the windows must resolve: those a rough first look at the strike finds and,
 * with a target, the template's expected partials — both, always, so that a target can only
 * add needs (a template never shortens the window below what the sound itself asks for,
 * and the lowest partial is resolved from DC whatever the template holds). Spacing is the
 * smallest distance between neighbours of either list; the lowest is the lower of both.
 */
export function windowNeedsFor(
  signal: Float64Array,
  sampleRate: number,
  span: { startIndex: number, endIndex: number },
  expectedHz: readonly number[] | null,
  forced: boolean,
): ResolvedNeeds {
  const rough = roughPartialSpacing(signal, sampleRate, span.startIndex, span.endIndex)
  const expected = [...new Set(expectedHz ?? [])].filter(f => f < sampleRate / 2).sort((a, b) => a - b)
  let spacingHz = rough?.spacingHz ?? Infinity
  for (let i = 1; i < expected.length; i++) spacingHz = Math.min(spacingHz, expected[i]! - expected[i - 1]!)
  const lows = [rough?.lowestHz, expected[0]].filter((f): f is number => f !== undefined)
  const lowestHz = lows.length > 0 ? Math.min(...lows) : 100
  // Weak rough peaks (noise, leakage) still set the long window, as always; only strong ones
  // keep the fast bands away from close pairs.
  const strong = (rough?.frequenciesHz ?? []).filter((_, i) => rough!.relativeDb[i]! >= -40)
  const knownHz = [...strong, ...expected].sort((a, b) => a - b)
  const windowFrom = forced ? 'option' : expected.length > 0 ? 'template' : rough ? 'rough-pass' : 'default'
  return { spacingHz, lowestHz, knownHz, windowFrom }
}
