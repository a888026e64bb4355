import { describe, expect, it } from 'vitest'
import { bendingWaveConstant, uniformBarF1Hz } from '../../../../shared/barModel/uniformBarF1Hz'
import { youngsModulusFromF1 } from '../../../../shared/barModel/youngsModulusFromF1'

// from memory: typical aluminium bar stock, E ≈ 69 GPa, ρ ≈ 2700 kg/m³.
const ALUMINIUM = { thicknessMm: 13, densityKgM3: 2700, youngsModulusGPa: 69 }

describe('uniformBarF1Hz', () => {
  it('gives the free–free first mode of a uniform bar', () => {
    // source: f₁ = (4.7300² / 2π L²) √(E I / ρ A), I / A = t² / 12 (Blevins, Formulas for Natural Frequency
    // and Mode Shape, table 8-1), worked by hand for L = 400 mm: √(69e9 · 0.013² / (12 · 2700)) = 18.971 m²/s,
    // 4.7300² / (2π · 0.16 m²) = 22.254 /m², f₁ = 422.20 Hz.
    expect(bendingWaveConstant(ALUMINIUM)).toBeCloseTo(18.971, 3)
    expect(uniformBarF1Hz(400, ALUMINIUM)).toBeCloseTo(422.20, 1)
  })

  it('goes as thickness over length squared', () => {
    // common practice: halving a bar's length raises its note two octaves; doubling the thickness raises it one.
    const f = uniformBarF1Hz(400, ALUMINIUM)
    expect(uniformBarF1Hz(200, ALUMINIUM) / f).toBeCloseTo(4, 9)
    expect(uniformBarF1Hz(400, { ...ALUMINIUM, thicknessMm: 26 }) / f).toBeCloseTo(2, 9)
  })

  it('gives back the modulus a blank was graded with', () => {
    const f = uniformBarF1Hz(412, { thicknessMm: 24, densityKgM3: 980, youngsModulusGPa: 21.5 })
    expect(youngsModulusFromF1(f, { lengthM: 0.412, thicknessM: 0.024, densityKgM3: 980 }) / 1e9).toBeCloseTo(21.5, 9)
  })

  it('refuses figures no bar has', () => {
    expect(() => uniformBarF1Hz(0, ALUMINIUM)).toThrow(RangeError)
    expect(() => uniformBarF1Hz(300, { ...ALUMINIUM, youngsModulusGPa: -1 })).toThrow(RangeError)
    expect(() => uniformBarF1Hz(Number.NaN, ALUMINIUM)).toThrow(RangeError)
  })
})
