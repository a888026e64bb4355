import { resolveTarget, type ResolvedTarget } from './resolveTarget'
import { resolveTemplate } from './resolveTemplate'
import type { AnalyzeOptions, RatioTemplateInput } from './types'

/** What the strike is measured against: the target, its template and the expected partials. */
export interface ExpectedPartials {
  target: ResolvedTarget | null
  template: Required<RatioTemplateInput> | null
  /** ratio × fundamental of every template partial, Hz; null without a target. */
  expectedHz: number[] | null
}

/** The target and template of the options (none without a target) and where the template puts its partials. */
export function expectedPartials(opts: AnalyzeOptions): ExpectedPartials {
  const target = resolveTarget(opts)
  const template = target ? resolveTemplate(opts) : null
  const expectedHz = target && template ? template.partials.map(p => p.ratio * target.fundamentalHz) : null
  return { target, template, expectedHz }
}
