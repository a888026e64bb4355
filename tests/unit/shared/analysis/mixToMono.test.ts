import { describe, expect, it } from 'vitest'
import { mixToMono } from '../../../../shared/analysis/mixToMono'

describe('mixToMono', () => {
  it('averages the channels sample by sample', () => {
    // source: equal-weight downmix, mono = (L + R) / 2 (common practice)
    expect([...mixToMono([[1, 0.5, -1], [0, 0.5, 1]])]).toEqual([0.5, 0.5, 0])
    expect([...mixToMono([[0.3], [0.6], [0.9]])][0]).toBeCloseTo(0.6, 15)
  })

  it('returns a copy of a single channel', () => {
    const channel = Float64Array.from([0.25, -0.5])
    const mono = mixToMono([channel])
    expect([...mono]).toEqual([0.25, -0.5])
    mono[0] = 9
    expect(channel[0]).toBe(0.25)
  })

  it('cancels a signal and its inverse', () => {
    const a = Float64Array.from({ length: 100 }, (_, i) => Math.sin(i))
    expect(mixToMono([a, a.map(v => -v)]).every(v => v === 0)).toBe(true)
  })

  it('refuses no channels and channels of different lengths', () => {
    expect(() => mixToMono([])).toThrow(RangeError)
    expect(() => mixToMono([[1, 2], [1]])).toThrow(RangeError)
  })
})
