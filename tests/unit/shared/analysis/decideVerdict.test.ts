import { describe, expect, it } from 'vitest'
import { decideVerdict } from '../../../../shared/analysis/decideVerdict'
import { partialMatch } from '../../../support/partials'

const outside = partialMatch({ label: 'partial ×4', cents: 9, within: false, direction: 'sharp' })
const missing = partialMatch({ label: 'partial ×10', measuredHz: null, cents: null, rawCents: null, within: false, missing: true, amplitudeDb: null })

describe('decideVerdict', () => {
  it('is within when every required partial is within its tolerance', () => {
    expect(decideVerdict([partialMatch(), partialMatch({ label: 'partial ×4', cents: -4.9 })])).toBe('within')
  })

  it('is outside when a required partial is outside, even with another missing', () => {
    // common practice: a partial out of tolerance means the piece goes back to the bench
    expect(decideVerdict([partialMatch(), outside])).toBe('outside')
    expect(decideVerdict([missing, outside])).toBe('outside')
  })

  it('is incomplete when a required partial is missing and none is outside', () => {
    expect(decideVerdict([partialMatch(), missing])).toBe('incomplete')
  })

  it('lets optional partials change nothing', () => {
    const optional = (m: typeof outside) => ({ ...m, required: false })
    expect(decideVerdict([partialMatch(), optional(outside), optional(missing)])).toBe('within')
    expect(decideVerdict([])).toBe('within')
  })
})
