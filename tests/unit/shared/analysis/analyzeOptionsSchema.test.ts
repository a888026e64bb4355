import { describe, expect, it } from 'vitest'
import { AnalysisError } from '../../../../shared/analysis/AnalysisError'
import { AnalyzeOptionsSchema } from '../../../../shared/analysis/analyzeOptionsSchema'
import { analyzeSamples } from '../../../../shared/analysis/analyzeSamples'

describe('AnalyzeOptionsSchema', () => {
  it('the typed options refuse unknown keys', () => {
    expect(AnalyzeOptionsSchema.safeParse({ note: 'A4', colour: 'red' }).success).toBe(false)
    expect(() => analyzeSamples(new Float64Array(48000), 48000, { colour: 'red' } as never)).toThrow(/"colour" is not an analysis option/)
  })

  it('the schema accepts a stored template and refuses a malformed one', () => {
    const template = { partials: [{ label: 'fundamental', ratio: 1, toleranceCents: 2, required: true }] }
    expect(AnalyzeOptionsSchema.safeParse({ note: 'A4', template }).success).toBe(true)
    expect(AnalyzeOptionsSchema.safeParse({ note: 'A4', template: { partials: [] } }).success).toBe(false)
    expect(() => analyzeSamples(new Float64Array(48000), 48000, { note: 'A4', template: { partials: [] } })).toThrow(AnalysisError)
  })
})
