import { describe, expect, it } from 'vitest'
import { cutDepthLimitsMm } from '../../../../shared/barModel/cutDepthLimitsMm'

describe('cutDepthLimitsMm', () => {
  it('keeps the thinnest point a cut reaches above the minimum, and each cut within the maximum depth', () => {
    // An undercut-like profile: 20 mm at the ends, 8 mm at x = 100 (between stations 50 and 150).
    const profile = [{ xMm: 0, thicknessMm: 20 }, { xMm: 100, thicknessMm: 8 }, { xMm: 200, thicknessMm: 20 }]
    const limits = cutDepthLimitsMm(profile, [0, 50, 150, 200], { maxDepthMm: 3, minThicknessMm: 6 })
    // source: arithmetic on the profile (common practice): station 50 reaches 0…150, whose thinnest point is 8 mm → 2 mm
    expect(Array.from(limits)).toEqual([3, 2, 2, 3])
  })

  it('allows nothing where the bar is already at the minimum', () => {
    const profile = [{ xMm: 0, thicknessMm: 5 }, { xMm: 100, thicknessMm: 5 }]
    expect(Array.from(cutDepthLimitsMm(profile, [0, 50, 100], { maxDepthMm: 3, minThicknessMm: 6 }))).toEqual([0, 0, 0])
  })
})
