import { describe, expect, it } from 'vitest'
import { defaultBarGeometry } from '../../../../shared/barModel/defaultBarGeometry'
import { solveBarModes } from '../../../../shared/barModel/solveBarModes'

/** Length of a uniform free–free bar whose first mode is fHz. source: f₁ = (4.7300² / 2π L²) √(E h² / 12 ρ) (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1) */
const uniformLengthMm = (fHz: number, hMm: number, eGPa: number, rho: number) =>
  1000 * Math.sqrt((4.7300 ** 2 / (2 * Math.PI * fHz)) * Math.sqrt((eGPa * 1e9 * (hMm / 1000) ** 2) / (12 * rho)))

describe('defaultBarGeometry', () => {
  it('gives a flat aluminium plate the length the free–free formula gives for its note', () => {
    // A5 = 880 Hz (ISO 16:1975, A4 = 440 Hz)
    const plate = defaultBarGeometry('plate', 880, 'aluminium')
    expect(plate.profile).toHaveLength(2)
    const expected = uniformLengthMm(880, 8, 69, 2700)
    expect(Math.abs(plate.lengthMm / expected - 1)).toBeLessThan(0.001)
  })

  it('puts an undercut rosewood bar\'s first mode on the target, shorter than a flat bar of the same thickness', () => {
    const bar = defaultBarGeometry('bar', 440, 'rosewood')
    const f1 = solveBarModes(bar, { modes: 1 }).frequenciesHz[0]!
    expect(Math.abs(1200 * Math.log2(f1 / 440))).toBeLessThan(2)
    // common practice: the undercut lowers the fundamental, so an undercut bar is shorter than a flat one for the same note
    expect(bar.lengthMm).toBeLessThan(uniformLengthMm(440, 22, 20, 1000))
    const centre = bar.profile[(bar.profile.length - 1) / 2]!
    expect(centre.xMm).toBeCloseTo(bar.lengthMm / 2, 1)
    expect(centre.thicknessMm).toBeCloseTo(11, 2)
    expect(bar.profile[0]).toEqual({ xMm: 0, thicknessMm: 22 })
    expect(bar.profile.at(-1)).toEqual({ xMm: bar.lengthMm, thicknessMm: 22 })
  })

  it('scales the length as 1/√f: two octaves up halves the bar', () => {
    // f₁ ∝ 1/L² for one shape (Blevins, table 8-1)
    const low = defaultBarGeometry('bar', 220, 'padauk')
    const high = defaultBarGeometry('bar', 880, 'padauk')
    expect(low.lengthMm / high.lengthMm).toBeCloseTo(2, 2)
  })

  it('refuses a note whose bar would be outside the model\'s lengths, in a plain sentence', () => {
    expect(() => defaultBarGeometry('bar', 2, 'rosewood')).toThrow(/outside the 20–3000 mm the model takes/)
    expect(() => defaultBarGeometry('bar', Number.NaN, 'rosewood')).toThrow(/positive number of hertz/)
  })
})
