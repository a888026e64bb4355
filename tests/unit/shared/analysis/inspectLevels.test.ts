import { describe, expect, it } from 'vitest'
import { CLIP_LEVEL, inspectLevels } from '../../../../shared/analysis/inspectLevels'

describe('inspectLevels', () => {
  it('counts the largest 16-bit codes as clipped and finds the peak over every channel', () => {
    // source: 16-bit PCM, largest positive code 32767 = 1 − 2⁻¹⁵ of full scale, most negative −32768 = −1
    const top = 32767 / 32768
    const report = inspectLevels([[0.1, top, -0.2], [-1, 0.5, 0]])
    expect(report).toEqual({ clippedSamples: 2, peak: 1, invalidSamples: 0 })
    expect(top).toBeGreaterThanOrEqual(CLIP_LEVEL)
    expect(inspectLevels([[0.99, -0.99]]).clippedSamples).toBe(0)
  })

  it('counts non-finite samples apart and leaves them out of the peak', () => {
    expect(inspectLevels([[Number.NaN, 0.25, Number.POSITIVE_INFINITY, -Number.POSITIVE_INFINITY]])).toEqual({ clippedSamples: 0, peak: 0.25, invalidSamples: 3 })
  })

  it('reports nothing for silence', () => {
    expect(inspectLevels([new Float64Array(100)])).toEqual({ clippedSamples: 0, peak: 0, invalidSamples: 0 })
  })
})
