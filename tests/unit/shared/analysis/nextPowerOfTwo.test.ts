import { describe, expect, it } from 'vitest'
import { nextPowerOfTwo } from '../../../../shared/analysis/nextPowerOfTwo'

describe('nextPowerOfTwo', () => {
  it('gives the smallest power of two not below n', () => {
    // source: powers of two 1, 2, 4, …, 1024, 2048 (common practice)
    expect([1, 2, 3, 4, 5, 1000, 1024, 1025].map(nextPowerOfTwo)).toEqual([1, 2, 4, 4, 8, 1024, 1024, 2048])
    for (let e = 1; e < 25; e++) {
      expect(nextPowerOfTwo(2 ** e)).toBe(2 ** e)
      expect(nextPowerOfTwo(2 ** e + 1)).toBe(2 ** (e + 1))
    }
  })

  it('answers 1 for values below one', () => {
    expect([0, -5, 0.5, Number.NaN].map(nextPowerOfTwo)).toEqual([1, 1, 1, 1])
  })
})
