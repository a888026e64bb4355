import { describe, expect, it } from 'vitest'
import { formatCents, formatHz, formatNumber, formatT60, partialState } from '../../../../shared/format/numbers'

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

  it('gives a T60 as a figure only where a strike recording can show it', () => {
    // source: T60 = 60 / decay rate in dB/s (definition of the reverberation time, ISO 3382-1:2009, 3.5).
    expect(formatT60(60 / 7.5)).toBe('8.00 s')
    expect(formatT60(60 / 0.75)).toBe('80.00 s')
    // A hum line read at 0.0006 dB/s would otherwise show a T60 of 100 000 s.
    expect(formatT60(60 / 0.0006)).toBe('over 100 s')
    expect(formatT60(null)).toBe('—')
  })

  it('tells within, sharp, flat and missing apart', () => {
    expect(partialState({ within: true, missing: false, cents: 1 })).toBe('within')
    expect(partialState({ within: false, missing: false, cents: 7 })).toBe('sharp')
    expect(partialState({ within: false, missing: false, cents: -7 })).toBe('flat')
    expect(partialState({ within: false, missing: true, cents: null })).toBe('missing')
  })
})
