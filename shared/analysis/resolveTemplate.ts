import type { AnalyzeOptions, RatioTemplateInput, TemplatePartialSpec } from './types'

/** Defaults of a template built from bare options. */
export const TEMPLATE_DEFAULTS = {
  toleranceCents: 5,
  searchWindowCents: 100,
  referenceTemperatureC: 20,
  temperatureCoefficientCentsPerC: 0,
} as const

/** Label of a template partial that was given no label. */
export function defaultPartialLabel(ratio: number): string {
  return ratio === 1 ? 'fundamental' : `partial ×${ratio}`
}

/**
 * The ratio template an analysis matches against: `options.template` as given, or one
 * built from `ratios` (default [1]), `tolerances` (one value applies to all; default
 * 5 ¢), `labels` and `required` (default all required). Partials come out sorted by ratio.
 */
export function resolveTemplate(options: AnalyzeOptions): Required<RatioTemplateInput> {
  const source = options.template
  let partials: TemplatePartialSpec[]
  if (source) {
    partials = source.partials.map(p => ({ ...p }))
  }
  else {
    const ratios = options.ratios ?? [1]
    const tolerances = options.tolerances ?? [TEMPLATE_DEFAULTS.toleranceCents]
    partials = ratios.map((ratio, i) => ({
      label: options.labels?.[i] ?? defaultPartialLabel(ratio),
      ratio,
      toleranceCents: tolerances.length === 1 ? tolerances[0]! : tolerances[i]!,
      required: options.required?.[i] ?? true,
    }))
  }
  partials.sort((a, b) => a.ratio - b.ratio)
  return {
    partials,
    searchWindowCents: source?.searchWindowCents ?? options.searchWindowCents ?? TEMPLATE_DEFAULTS.searchWindowCents,
    referenceTemperatureC:
      source?.referenceTemperatureC ?? options.referenceTemperatureC ?? TEMPLATE_DEFAULTS.referenceTemperatureC,
    temperatureCoefficientCentsPerC:
      source?.temperatureCoefficientCentsPerC
      ?? options.temperatureCoefficientCentsPerC
      ?? TEMPLATE_DEFAULTS.temperatureCoefficientCentsPerC,
  }
}
