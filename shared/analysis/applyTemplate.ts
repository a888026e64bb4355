import { decideVerdict } from './decideVerdict'
import { guidanceLines } from './guidanceLines'
import { matchTemplate } from './matchTemplate'
import type { ResolvedTarget } from './resolveTarget'
import type { AnalysisResult, MeasuredPartial, RatioTemplateInput } from './types'

/**
 * Match the template against the partials and fill the result's target, template,
 * matches, fundamental, verdict and guidance, with a warning per missing partial.
 */
export function applyTemplate(
  result: AnalysisResult,
  partials: readonly MeasuredPartial[],
  target: ResolvedTarget,
  template: Required<RatioTemplateInput>,
  temperatureC: number | null,
): void {
  const matches = matchTemplate(partials, template, target.fundamentalHz, temperatureC)
  for (const m of matches) {
    if (m.targetHz >= result.sampleRate / 2) result.warnings.push(`${m.label} (${m.targetHz.toFixed(2)} Hz) lies above the highest frequency this recording can hold`)
    else if (m.missing) result.warnings.push(`no partial found near ${m.targetHz.toFixed(2)} Hz (${m.label})`)
  }
  result.target = target
  result.template = template
  result.temperatureC = temperatureC
  result.matches = matches
  result.fundamentalHz = matches.find(m => m.ratio === 1)?.measuredHz ?? null
  result.verdict = decideVerdict(matches)
  result.guidance = guidanceLines(matches)
}
