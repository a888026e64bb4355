import { describe, expect, it } from 'vitest'
import { guidanceLines } from '../../../../shared/analysis/guidanceLines'
import { partialMatch } from '../../../support/partials'

describe('guidanceLines', () => {
  it('writes one plain line per partial that is outside', () => {
    const lines = guidanceLines([
      partialMatch({}),
      partialMatch({ label: 'partial ×4', ratio: 4, targetHz: 1760, measuredHz: 1765.1, cents: 5.01, within: false, toleranceCents: 3 }),
      partialMatch({ label: 'partial ×10', ratio: 10, targetHz: 4400, measuredHz: 4390, cents: -3.94, within: false, toleranceCents: 3, required: false }),
      partialMatch({ label: 'x', missing: true, within: false, measuredHz: null, cents: null }),
    ])
    expect(lines).toEqual([
      'Partial ×4 is 5.0 ¢ sharp: measured 1765.10 Hz, target 1760.00 Hz, tolerance ±3 ¢.',
      'Partial ×10 (not required) is 3.9 ¢ flat: measured 4390.00 Hz, target 4400.00 Hz, tolerance ±3 ¢.',
    ])
  })
})
