import { describe, expect, it } from 'vitest'
import { isSymmetricProfile } from '../../../../shared/barModel/isSymmetricProfile'
import { meshNodesMm } from '../../../../shared/barModel/meshNodesMm'
import { thicknessAtMm } from '../../../../shared/barModel/thicknessAtMm'

describe('meshNodesMm', () => {
  it('puts a node on every profile station, moving a nearby node rather than adding a sliver', () => {
    const profile = [{ xMm: 0, thicknessMm: 10 }, { xMm: 30.5, thicknessMm: 8 }, { xMm: 55, thicknessMm: 8 }, { xMm: 100, thicknessMm: 10 }]
    const nodes = Array.from(meshNodesMm(100, profile, 10))
    // source: arithmetic (common practice): steps of 10 mm; 30.5 replaces 30, 55 is added between 50 and 60
    expect(nodes).toEqual([0, 10, 20, 30.5, 40, 50, 55, 60, 70, 80, 90, 100])
  })
})

describe('thicknessAtMm and isSymmetricProfile', () => {
  const arch = [{ xMm: 0, thicknessMm: 20 }, { xMm: 100, thicknessMm: 10 }, { xMm: 200, thicknessMm: 20 }]

  it('interpolates linearly between stations and holds the end values beyond them', () => {
    // source: linear interpolation (common practice)
    expect(thicknessAtMm(arch, 50)).toBe(15)
    expect(thicknessAtMm(arch, 250)).toBe(20)
  })

  it('tells a symmetric arch from a lopsided one', () => {
    expect(isSymmetricProfile(arch, 200)).toBe(true)
    expect(isSymmetricProfile([{ xMm: 0, thicknessMm: 20 }, { xMm: 80, thicknessMm: 10 }, { xMm: 200, thicknessMm: 20 }], 200)).toBe(false)
  })
})
