import { describe, expect, it } from 'vitest'
import { blackmanHarris } from '../../../../shared/analysis/blackmanHarris'
import { cachedBlackmanHarris } from '../../../../shared/analysis/cachedBlackmanHarris'

describe('cachedBlackmanHarris', () => {
  it('gives the window blackmanHarris makes, once per length and period', () => {
    const first = cachedBlackmanHarris(1000, 812.5)
    expect(first).toEqual(blackmanHarris(1000, 812.5))
    expect(cachedBlackmanHarris(1000, 812.5)).toBe(first)
    expect(cachedBlackmanHarris(1000)).not.toBe(first)
    // source: Harris (1978), minimum 4-term Blackman–Harris: w(0) = a0 − a1 + a2 − a3 = 0.00006, w(N/2) = a0 + a1 + a2 + a3 = 1
    expect(cachedBlackmanHarris(1000)[0]).toBeCloseTo(0.00006, 12)
    expect(cachedBlackmanHarris(1000)[500]).toBeCloseTo(1, 12)
  })

  it('drops the least recently used windows when many are asked for', () => {
    const kept = cachedBlackmanHarris(64)
    for (let length = 100; length < 200; length++) cachedBlackmanHarris(length)
    expect(cachedBlackmanHarris(64)).not.toBe(kept)
    expect(cachedBlackmanHarris(64)).toEqual(kept)
  })

  it('refuses what blackmanHarris refuses', () => {
    expect(() => cachedBlackmanHarris(0)).toThrow(RangeError)
    expect(() => cachedBlackmanHarris(8, 0)).toThrow(RangeError)
  })
})
