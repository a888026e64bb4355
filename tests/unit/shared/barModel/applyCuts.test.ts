import { describe, expect, it } from 'vitest'
import { applyCuts } from '../../../../shared/barModel/applyCuts'
import { thicknessAtMm } from '../../../../shared/barModel/thicknessAtMm'

describe('applyCuts', () => {
  const profile = [{ xMm: 0, thicknessMm: 20 }, { xMm: 100, thicknessMm: 16 }, { xMm: 200, thicknessMm: 20 }]

  it('takes the linear depth from the linear thickness at every point', () => {
    // source: the difference of two piecewise-linear functions is linear between the union of their breakpoints (common practice)
    const cuts = [{ xMm: 50, depthMm: 0 }, { xMm: 80, depthMm: 1 }, { xMm: 130, depthMm: 0 }]
    const after = applyCuts(profile, cuts)
    expect(after.map(p => p.xMm)).toEqual([0, 50, 80, 100, 130, 200])
    expect(thicknessAtMm(after, 80)).toBeCloseTo(20 - 4 * 0.8 - 1, 12)
    expect(thicknessAtMm(after, 90)).toBeCloseTo(20 - 4 * 0.9 - 1 * (40 / 50), 12)
    expect(thicknessAtMm(after, 20)).toBe(20 - 0.8)
  })

  it('refuses negative depths and stations out of order', () => {
    expect(() => applyCuts(profile, [{ xMm: 10, depthMm: -0.1 }])).toThrow(/negative/)
    expect(() => applyCuts(profile, [{ xMm: 10, depthMm: 0 }, { xMm: 10, depthMm: 1 }])).toThrow(/left to right/)
  })
})
