import { describe, expect, it } from 'vitest'
import { LINE_PULL_SHARE, partialUncertaintyCents } from '../../../../shared/analysis/partialUncertaintyCents'

describe('partialUncertaintyCents', () => {
  it('adds the bound, the spread of two readings (Δ/√2) and 5 % of the line\'s half-width in quadrature', () => {
    // 600 dB/s (T60 0.1 s) is α = 69.08 Np/s, a half-width α/2π = 10.994 Hz: at 3 kHz that is
    // 1200·log2(1 + 10.994/3000) = 6.3328 ¢ (source: a damped sinusoid's Lorentzian line, half-width
    // at half power α/2π, common practice).
    const line = LINE_PULL_SHARE * 6.3328
    expect(partialUncertaintyCents(0.03, 0.2, 3000, 600)).toBeCloseTo(Math.hypot(0.03, 0.2 / Math.SQRT2, line), 4)
    expect(partialUncertaintyCents(0, 0, 3000, 600)).toBeCloseTo(line, 4)
  })

  it('adds nothing for a line that does not decay, and next to nothing for a chime\'s slow one', () => {
    expect(partialUncertaintyCents(0.01, 0.02, 440, 0)).toBeCloseTo(Math.hypot(0.01, 0.02 / Math.SQRT2), 12)
    expect(partialUncertaintyCents(0.01, 0.02, 440, -3)).toBeCloseTo(Math.hypot(0.01, 0.02 / Math.SQRT2), 12)
    // 3 dB/s at 523 Hz: half-width 0.055 Hz = 0.18 ¢, allowance 0.009 ¢.
    expect(partialUncertaintyCents(0, 0, 523.25, 3)).toBeLessThan(0.01)
  })

  it('refuses a frequency that is not positive', () => {
    expect(() => partialUncertaintyCents(0, 0, 0, 10)).toThrow(RangeError)
    expect(() => partialUncertaintyCents(0, 0, Number.NaN, 10)).toThrow(RangeError)
  })
})
