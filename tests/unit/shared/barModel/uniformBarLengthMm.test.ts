import { describe, expect, it } from 'vitest'
import { uniformBarF1Hz } from '../../../../shared/barModel/uniformBarF1Hz'
import { uniformBarLengthMm } from '../../../../shared/barModel/uniformBarLengthMm'

// from memory: a rosewood-like bar, E ≈ 20 GPa, ρ ≈ 1000 kg/m³, 22 mm thick.
const ROSEWOOD = { thicknessMm: 22, densityKgM3: 1000, youngsModulusGPa: 20 }

describe('uniformBarLengthMm', () => {
  it('is the length whose first free–free mode is the note', () => {
    // source: L = √((4.7300² / 2π f) · √(E t² / 12 ρ)) from f₁ = (4.7300² / 2π L²) √(E I / ρ A) (Blevins, table 8-1),
    // worked by hand for A4 = 440 Hz (ISO 16:1975): √(E t² / 12 ρ) = 28.402 m²/s, L = 479.4 mm.
    expect(uniformBarLengthMm(440, ROSEWOOD)).toBeCloseTo(479.4, 1)
    expect(uniformBarF1Hz(uniformBarLengthMm(440, ROSEWOOD), ROSEWOOD)).toBeCloseTo(440, 9)
  })

  it('shortens by √2 per octave up', () => {
    // common practice: a uniform bar an octave higher is 1/√2 as long (f ∝ 1/L²).
    expect(uniformBarLengthMm(440, ROSEWOOD) / uniformBarLengthMm(880, ROSEWOOD)).toBeCloseTo(Math.SQRT2, 9)
  })

  it('refuses a frequency that is not one', () => {
    expect(() => uniformBarLengthMm(0, ROSEWOOD)).toThrow(RangeError)
    expect(() => uniformBarLengthMm(Number.POSITIVE_INFINITY, ROSEWOOD)).toThrow(RangeError)
  })
})
