import { describe, expect, it } from 'vitest'
import { isSymmetricProfile } from '../../../../shared/barModel/isSymmetricProfile'
import { applyCuts } from '../../../../shared/barModel/applyCuts'
import { defaultBarGeometry } from '../../../../shared/barModel/defaultBarGeometry'
import { meshNodesMm } from '../../../../shared/barModel/meshNodesMm'
import { solveBarModes } from '../../../../shared/barModel/solveBarModes'
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
  it('merges stations a few µm apart, so stations that do not change the bar do not change its modes', () => {
    const nodes = meshNodesMm(100, [{ xMm: 0, thicknessMm: 10 }, { xMm: 25, thicknessMm: 9 }, { xMm: 25.004, thicknessMm: 9 }, { xMm: 100, thicknessMm: 10 }], 40)
    for (let i = 1; i < nodes.length; i++) expect(nodes[i]! - nodes[i - 1]!).toBeGreaterThan(100 / 40 / 1000)
    expect(nodes.at(-1)).toBe(100)
    // Identity: zero-depth cuts add stations on the straight parts of the profile and leave the bar as it was.
    const bar = defaultBarGeometry('bar', 261.6256, 'rosewood')
    const same = { ...bar, profile: applyCuts(bar.profile, Array.from({ length: 21 }, (_, j) => ({ xMm: (bar.lengthMm * j) / 20, depthMm: 0 }))) }
    const a = solveBarModes(bar).frequenciesHz
    const b = solveBarModes(same).frequenciesHz
    for (let m = 0; m < 4; m++) expect(Math.abs(b[m]! / a[m]! - 1)).toBeLessThan(1e-5)
  })
})
