import { decideVerdict } from './decideVerdict'
import { guidanceLines } from './guidanceLines'
import { matchTemplate } from './matchTemplate'
import type { ResolvedTarget } from './resolveTarget'
import type { AnalysisResult, MeasuredPartial, RatioTemplateInput } from './types'

/**
 * Match the template against the partials: a new result with the target, template,
 * matches, fundamental, verdict and guidance filled in, and a warning per missing partial
 * (or per template partial above the recording's band) after the result's own.
 */
export function applyTemplate(
  result: AnalysisResult,
  partials: readonly MeasuredPartial[],
  target: ResolvedTarget,
  template: Required<RatioTemplateInput>,
  temperatureC: number | null,
): AnalysisResult {
  const matches = matchTemplate(partials, template, target.fundamentalHz, temperatureC)
  const missing = matches.flatMap((m) => {
    if (m.targetHz >= result.sampleRate / 2) return [`${m.label} (${m.targetHz.toFixed(2)} Hz) lies above the highest frequency this recording can hold`]
    return m.missing ? [`no partial found near ${m.targetHz.toFixed(2)} Hz (${m.label})`] : []
  })
  return {
    ...result,
    fundamentalHz: matches.find(m => m.ratio === 1)?.measuredHz ?? null,
    verdict: decideVerdict(matches),
    guidance: guidanceLines(matches),
    warnings: [...result.warnings, ...missing],
    target,
    template,
    temperatureC,
    matches,
  }
}
