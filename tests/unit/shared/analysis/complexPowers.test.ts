import { describe, expect, it } from 'vitest'
import { complexPowers } from '../../../../shared/analysis/complexPowers'

describe('complexPowers', () => {
  it('gives iᵐ = 1, i, −1, −i, … for z = i', () => {
    const { re, im } = complexPowers(0, 1, 8)
    // source: i² = −1 (definition of the imaginary unit)
    expect(Array.from(re)).toEqual([1, 0, -1, -0, 1, 0, -1, -0])
    expect(Array.from(im)).toEqual([0, 1, 0, -1, -0, 1, 0, -1])
  })

  it('follows e^{(−δ + iω)m} = e^{−δm}(cos ωm + i sin ωm) over 200 samples', () => {
    const damping = 0.01
    const omega = 2 * Math.PI * 0.0731
    const { re, im } = complexPowers(Math.exp(-damping) * Math.cos(omega), Math.exp(-damping) * Math.sin(omega), 200)
    for (let m = 0; m < 200; m++) {
      // source: Euler's formula e^{iθ} = cos θ + i sin θ
      expect(re[m]).toBeCloseTo(Math.exp(-damping * m) * Math.cos(omega * m), 12)
      expect(im[m]).toBeCloseTo(Math.exp(-damping * m) * Math.sin(omega * m), 12)
    }
  })

  it('fills the buffers it is given, carries a non-finite z through, and refuses short buffers or a bad count', () => {
    const out = { re: new Float64Array(5), im: new Float64Array(5) }
    // source: arithmetic — powers of 2: 1, 2, 4, 8
    expect(complexPowers(2, 0, 4, out)).toBe(out)
    expect(Array.from(out.re)).toEqual([1, 2, 4, 8, 0])
    expect(() => complexPowers(2, 0, 6, out)).toThrow(RangeError)
    // source: IEEE 754 — NaN propagates through arithmetic (z⁰ = 1 is set, not computed)
    expect(Array.from(complexPowers(Number.NaN, 0, 3).re)).toEqual([1, Number.NaN, Number.NaN])
    expect(() => complexPowers(1, 0, -1)).toThrow(RangeError)
  })
})
