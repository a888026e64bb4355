import { describe, expect, it } from 'vitest'
import { partialUncertaintyDecayPct } from '../../../../shared/analysis/partialUncertaintyDecayPct'

describe('partialUncertaintyDecayPct', () => {
  it('is the bound alone, in % of the decay, for a single reading on a straight curve', () => {
    expect(partialUncertaintyDecayPct(0.6, 0, 30)).toBeCloseTo(2, 12)
  })

  it('adds the two readings\' spread Δ/√2 and a bend as a rectangular half-width b/√3, in quadrature', () => {
    // source: JCGM 100:2008 (GUM) §5.1.2 for independent terms in quadrature, §4.3.7 for u = a/√3.
    const expected = (100 * Math.sqrt(0.3 ** 2 + (0.8 / Math.SQRT2) ** 2 + (1.5 / Math.sqrt(3)) ** 2)) / 20
    expect(partialUncertaintyDecayPct(0.3, 0.8, 20, 1.5)).toBeCloseTo(expected, 12)
    expect(partialUncertaintyDecayPct(0.3, -0.8, 20, -1.5)).toBeCloseTo(expected, 12)
  })

  it('is null for a partial that does not decay', () => {
    expect(partialUncertaintyDecayPct(0.1, 0, 0)).toBeNull()
    expect(partialUncertaintyDecayPct(0.1, 0, -2)).toBeNull()
  })
})
