import { freeFreeBetaL } from '../bench/freeFreeBeam'

/**
 * Young's modulus (Pa) of a uniform rectangular bar from its first free–free bending mode,
 * Euler–Bernoulli: f₁ = (β₁L)² / (2π L²) · √(E I / ρ A), with I / A = t² / 12, so
 * E = 12 ρ (2π f₁ L²)² / ((β₁L)⁴ t²) (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1).
 */
export function youngsModulusFromF1(frequencyHz: number, bar: { lengthM: number, thicknessM: number, densityKgM3: number }): number {
  if (!(frequencyHz > 0) || !(bar.lengthM > 0) || !(bar.thicknessM > 0) || !(bar.densityKgM3 > 0)) {
    throw new RangeError('frequency, length, thickness and density must be positive')
  }
  const betaL = freeFreeBetaL(1)
  return (12 * bar.densityKgM3 * (2 * Math.PI * frequencyHz * bar.lengthM ** 2) ** 2) / (betaL ** 4 * bar.thicknessM ** 2)
}
