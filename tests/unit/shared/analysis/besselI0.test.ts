import { describe, expect, it } from 'vitest'
import { besselI0 } from '../../../../shared/analysis/besselI0'

/** The defining power series Σ ((x/2)^k / k!)², summed to full precision. */
function seriesI0(x: number): number {
  let term = 1
  let sum = 1
  for (let k = 1; k < 400 && term > sum * 1e-18; k++) {
    term *= (x / 2 / k) ** 2
    sum += term
  }
  return sum
}

describe('besselI0', () => {
  it('matches tabulated values', () => {
    // source: Abramowitz & Stegun (1964) Table 9.8 / DLMF 10.25.2 series; from memory to 10 digits
    const table: [number, number][] = [[0, 1], [1, 1.266065878], [2, 2.279585302], [5, 27.23987182], [10, 2815.716628]]
    for (const [x, value] of table) expect(Math.abs(besselI0(x) / value - 1)).toBeLessThan(2e-7)
  })

  it('agrees with its power series within the stated error on both branches', () => {
    for (let x = 0; x <= 20; x += 0.37) {
      // source: Abramowitz & Stegun 9.8.1–9.8.2, relative error below 1.9e-7
      expect(Math.abs(besselI0(x) / seriesI0(x) - 1)).toBeLessThan(2e-7)
      expect(besselI0(-x)).toBe(besselI0(x))
    }
  })

  it('refuses a non-finite argument', () => {
    expect(() => besselI0(Number.NaN)).toThrow(RangeError)
  })
})
