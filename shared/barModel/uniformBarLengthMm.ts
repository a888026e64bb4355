import { freeFreeBetaL } from '../bench/freeFreeBeam'
import { bendingWaveConstant, type UniformBarMaterial } from './uniformBarF1Hz'

/**
 * Length (mm) of a uniform rectangular bar whose first free–free bending mode is the given
 * frequency: the Euler–Bernoulli formula f₁ = (β₁L)² / (2π L²) · √(E I / ρ A) solved for L
 * (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1).
 */
export function uniformBarLengthMm(frequencyHz: number, bar: UniformBarMaterial): number {
  if (!(frequencyHz > 0) || !Number.isFinite(frequencyHz)) throw new RangeError('the frequency must be a positive number of hertz')
  const lengthM = Math.sqrt((freeFreeBetaL(1) ** 2 * bendingWaveConstant(bar)) / (2 * Math.PI * frequencyHz))
  return lengthM * 1000
}
