import { describe, expect, it } from 'vitest'
import { formatCents, formatHz, formatNumber, partialState } from '../../../../shared/format/numbers'

describe('formatting', () => {
  it('writes signed cents with a true minus sign and the unit', () => {
    // source: Unicode U+2212 MINUS SIGN for negative figures (common practice in typesetting).
    expect(formatCents(3.24)).toBe('+3.2 ¢')
    expect(formatCents(-0.46)).toBe('−0.5 ¢')
    expect(formatCents(0.04)).toBe('±0.0 ¢')
    expect(formatCents(null)).toBe('—')
    expect(formatHz(261.6256)).toBe('261.63 Hz')
    expect(formatNumber(-2.5, '°C')).toBe('−2.5 °C')
  })

  it('tells within, sharp, flat and missing apart', () => {
    expect(partialState({ within: true, missing: false, cents: 1 })).toBe('within')
    expect(partialState({ within: false, missing: false, cents: 7 })).toBe('sharp')
    expect(partialState({ within: false, missing: false, cents: -7 })).toBe('flat')
    expect(partialState({ within: false, missing: true, cents: null })).toBe('missing')
  })
})
