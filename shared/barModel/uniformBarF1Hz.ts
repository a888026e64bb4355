import { freeFreeBetaL } from '../bench/freeFreeBeam'

/** A uniform bar's section and material, as a blank gives them. */
export interface UniformBarMaterial {
  thicknessMm: number
  densityKgM3: number
  youngsModulusGPa: number
}

/** √(E I / ρ A) in m²/s for a rectangular section (I / A = t² / 12): the bar's bending stiffness per mass. */
export function bendingWaveConstant(bar: UniformBarMaterial): number {
  if (!(bar.thicknessMm > 0) || !(bar.densityKgM3 > 0) || !(bar.youngsModulusGPa > 0)) {
    throw new RangeError('thickness, density and Young\'s modulus must be positive')
  }
  const thicknessM = bar.thicknessMm / 1000
  return Math.sqrt((bar.youngsModulusGPa * 1e9 * thicknessM ** 2) / (12 * bar.densityKgM3))
}

/**
 * First free–free bending mode (Hz) of a uniform rectangular bar of the given length,
 * Euler–Bernoulli: f₁ = (β₁L)² / (2π L²) · √(E I / ρ A), β₁L = 4.7300 (Blevins, Formulas for
 * Natural Frequency and Mode Shape, table 8-1). The width drops out.
 */
export function uniformBarF1Hz(lengthMm: number, bar: UniformBarMaterial): number {
  if (!(lengthMm > 0) || !Number.isFinite(lengthMm)) throw new RangeError('the length must be a positive number of millimetres')
  const lengthM = lengthMm / 1000
  return (freeFreeBetaL(1) ** 2 / (2 * Math.PI * lengthM ** 2)) * bendingWaveConstant(bar)
}
