import { describe, expect, it } from 'vitest'
import { ppmToCents } from '../../../../shared/uncertainty/ppmToCents'

describe('ppmToCents', () => {
  it('turns 100 ppm into about 0.173 cents', () => {
    expect(ppmToCents(100)).toBeCloseTo(0.1731, 4) // source: definition of the cent, 1200·log2(1.0001) = 0.17311
    expect(ppmToCents(0)).toBe(0)
  })

  it('turns a 48 kHz recording labelled 44.1 kHz into about 147 cents', () => {
    // source: definition of the cent, 1200·log2(48000/44100) = 146.7 ¢
    expect(ppmToCents((48000 / 44100 - 1) * 1e6)).toBeCloseTo(146.7, 1)
  })

  it('is odd to first order and exact for an octave', () => {
    expect(ppmToCents(1e6)).toBeCloseTo(1200, 9) // source: definition of the cent, an octave is 1200 cents
    // source: Taylor series ln(1 + x) + ln(1 − x) = −x² − …; 1200/ln2 · (−(5·10⁻⁵)²) = −4.328·10⁻⁶ ¢
    expect(ppmToCents(50) + ppmToCents(-50)).toBeCloseTo(-4.328e-6, 9)
  })

  it('refuses −10⁶ ppm and below, and non-finite values', () => {
    expect(() => ppmToCents(-1e6)).toThrow(RangeError)
    expect(() => ppmToCents(Number.POSITIVE_INFINITY)).toThrow(RangeError)
  })
})
