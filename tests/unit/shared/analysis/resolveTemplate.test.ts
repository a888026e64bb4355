import { describe, expect, it } from 'vitest'
import { defaultPartialLabel, resolveTemplate, TEMPLATE_DEFAULTS } from '../../../../shared/analysis/resolveTemplate'

describe('resolveTemplate', () => {
  it('builds a template from bare ratios, sorted, one tolerance for all', () => {
    // source: marimba bars are tuned 1 : 4 : 10 (common practice)
    const t = resolveTemplate({ ratios: [10, 1, 4], tolerances: [3] })
    expect(t.partials).toEqual([
      { label: 'fundamental', ratio: 1, toleranceCents: 3, required: true },
      { label: 'partial ×4', ratio: 4, toleranceCents: 3, required: true },
      { label: 'partial ×10', ratio: 10, toleranceCents: 3, required: true },
    ])
    expect(t.searchWindowCents).toBe(TEMPLATE_DEFAULTS.searchWindowCents)
  })

  it('pairs tolerances, labels and required flags with their ratios before sorting', () => {
    const t = resolveTemplate({ ratios: [2, 1], tolerances: [8, 2], labels: ['nominal', 'prime'], required: [false, true], searchWindowCents: 60 })
    expect(t.partials.map(p => [p.label, p.ratio, p.toleranceCents, p.required])).toEqual([['prime', 1, 2, true], ['nominal', 2, 8, false]])
    expect(t.searchWindowCents).toBe(60)
  })

  it('takes a stored template as given, without changing it', () => {
    const stored = {
      partials: [{ label: 'tierce', ratio: 1.2, toleranceCents: 4, required: true }, { label: 'hum', ratio: 0.5, toleranceCents: 10, required: false }],
      searchWindowCents: 80, referenceTemperatureC: 22, temperatureCoefficientCentsPerC: -0.3,
    }
    const before = structuredClone(stored)
    const t = resolveTemplate({ template: stored, ratios: [1], searchWindowCents: 30 })
    expect(t.partials.map(p => p.label)).toEqual(['hum', 'tierce'])
    expect(t).toMatchObject({ searchWindowCents: 80, referenceTemperatureC: 22, temperatureCoefficientCentsPerC: -0.3 })
    expect(stored).toEqual(before)
  })

  it('names an unlabelled partial by its ratio', () => {
    expect([1, 2.76, 0.5].map(defaultPartialLabel)).toEqual(['fundamental', 'partial ×2.76', 'partial ×0.5'])
    expect(resolveTemplate({}).partials).toEqual([{ label: 'fundamental', ratio: 1, toleranceCents: TEMPLATE_DEFAULTS.toleranceCents, required: true }])
  })
})
