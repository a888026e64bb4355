import { Matrix } from 'ml-matrix'
import { eulerBernoulliElement } from './eulerBernoulliElement'
import { meshNodesMm } from './meshNodesMm'
import { thicknessAtMm } from './thicknessAtMm'
import { timoshenkoElement } from './timoshenkoElement'
import type { BarGeometry, BeamModelOptions } from './types'

export const DEFAULT_ELEMENTS = 40

/**
 * Global stiffness K and mass M of a free–free bar (no supports: two degrees of freedom,
 * deflection and rotation, per node), assembled from its elements in SI units.
 */
export function assembleBeam(bar: BarGeometry, options: BeamModelOptions = {}): { stiffness: Matrix, mass: Matrix, nodesM: Float64Array } {
  const elements = options.elements ?? DEFAULT_ELEMENTS
  if (!Number.isInteger(elements) || elements < 2 || elements > 400) throw new RangeError('elements must be a whole number from 2 to 400')
  const nodesMm = meshNodesMm(bar.lengthMm, bar.profile, elements)
  const n = nodesMm.length
  const stiffness = Matrix.zeros(2 * n, 2 * n)
  const mass = Matrix.zeros(2 * n, 2 * n)
  const youngsModulusPa = bar.youngsModulusGPa * 1e9
  const section = {
    widthM: bar.widthMm / 1000,
    densityKgM3: bar.densityKgM3,
    youngsModulusPa,
    shearModulusPa: (options.shearModulusGPa ?? bar.youngsModulusGPa / 16) * 1e9,
    shearCoefficient: options.shearCoefficient ?? 5 / 6,
  }
  const timoshenko = options.theory === 'timoshenko'
  for (let e = 0; e < n - 1; e++) {
    const h1 = thicknessAtMm(bar.profile, nodesMm[e]!) / 1000
    const h2 = thicknessAtMm(bar.profile, nodesMm[e + 1]!) / 1000
    const lengthM = (nodesMm[e + 1]! - nodesMm[e]!) / 1000
    const element = timoshenko ? timoshenkoElement(h1, h2, lengthM, section) : eulerBernoulliElement(h1, h2, lengthM, section)
    const base = 2 * e
    for (let i = 0; i < 4; i++) {
      for (let j = 0; j < 4; j++) {
        stiffness.set(base + i, base + j, stiffness.get(base + i, base + j) + element.stiffness[i * 4 + j]!)
        mass.set(base + i, base + j, mass.get(base + i, base + j) + element.mass[i * 4 + j]!)
      }
    }
  }
  return { stiffness, mass, nodesM: nodesMm.map(x => x / 1000) }
}
