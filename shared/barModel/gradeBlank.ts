import { lossFactorFromDecay } from './lossFactorFromDecay'
import { solveBarModes } from './solveBarModes'
import { youngsModulusFromF1 } from './youngsModulusFromF1'

export interface BlankMeasurement {
  lengthMm: number
  widthMm: number
  thicknessMm: number
  massG: number
  f1Hz: number
  decayDbPerS?: number
}

export interface BlankFigures {
  densityKgM3: number
  /** Euler–Bernoulli value, GPa. */
  youngsModulusGPa: number
  /** With shear and rotary inertia (shear modulus E / 16, usual along the grain of wood), GPa. */
  youngsModulusTimoshenkoGPa: number
  /** E / ρ in GPa per g/cm³ (the same number as MN·m/kg). */
  specificModulus: number
  lossFactor: number | null
}

/** Elements for the Timoshenko correction: the ratio of two solves on one mesh converges long before each frequency does. */
const ELEMENTS = 16

/**
 * What a rectangular blank's dimensions, mass and first free–free bending mode say about its
 * material. The Timoshenko value scales the Euler–Bernoulli one by the square of the ratio of
 * the bar model's first mode without and with shear and rotary inertia: with E/G fixed the
 * frequency goes as √E, so that ratio holds for any E.
 */
export function gradeBlank(blank: BlankMeasurement): BlankFigures {
  const { lengthMm, widthMm, thicknessMm, massG, f1Hz } = blank
  if (![lengthMm, widthMm, thicknessMm, massG, f1Hz].every(v => Number.isFinite(v) && v > 0)) throw new RangeError('every dimension, the mass and the frequency must be positive')
  const densityKgM3 = (massG / 1000) / ((lengthMm * widthMm * thicknessMm) / 1e9)
  const eulerPa = youngsModulusFromF1(f1Hz, { lengthM: lengthMm / 1000, thicknessM: thicknessMm / 1000, densityKgM3 })
  const bar = { lengthMm, widthMm, profile: [{ xMm: 0, thicknessMm }, { xMm: lengthMm, thicknessMm }], densityKgM3, youngsModulusGPa: eulerPa / 1e9 }
  const plain = solveBarModes(bar, { elements: ELEMENTS, modes: 1 }).frequenciesHz[0]!
  const thick = solveBarModes(bar, { elements: ELEMENTS, modes: 1, theory: 'timoshenko' }).frequenciesHz[0]!
  const youngsModulusGPa = eulerPa / 1e9
  return {
    densityKgM3,
    youngsModulusGPa,
    youngsModulusTimoshenkoGPa: youngsModulusGPa * (plain / thick) ** 2,
    specificModulus: youngsModulusGPa / (densityKgM3 / 1000),
    lossFactor: blank.decayDbPerS === undefined ? null : lossFactorFromDecay(blank.decayDbPerS, f1Hz),
  }
}
