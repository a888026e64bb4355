import { GAUSS_POINTS, GAUSS_WEIGHTS } from './gaussLegendre'
import { hermiteCubic } from './hermiteCubic'
import { sectionProperties } from './sectionProperties'

/**
 * Stiffness and consistent mass matrices (4 × 4, row-major) of an Euler–Bernoulli beam
 * element whose thickness goes linearly from `startThicknessM` to `endThicknessM`:
 * K = ∫ EI N″ᵀN″ dx, M = ∫ ρA NᵀN dx with Hermite cubics, integrated by a four-point
 * Gauss rule, which is exact here (EI is cubic and ρA linear along the element).
 */
export function eulerBernoulliElement(startThicknessM: number, endThicknessM: number, lengthM: number, section: { widthM: number, densityKgM3: number, youngsModulusPa: number }): { stiffness: Float64Array, mass: Float64Array } {
  if (!(lengthM > 0)) throw new RangeError('element length must be positive')
  const stiffness = new Float64Array(16)
  const mass = new Float64Array(16)
  for (let g = 0; g < GAUSS_POINTS.length; g++) {
    const xi = GAUSS_POINTS[g]!
    const h = startThicknessM + (endThicknessM - startThicknessM) * xi
    const p = sectionProperties(h, section.widthM, section.densityKgM3, section.youngsModulusPa)
    const { value, curvature } = hermiteCubic(xi, lengthM)
    const w = GAUSS_WEIGHTS[g]! * lengthM
    for (let i = 0; i < 4; i++) {
      for (let j = 0; j < 4; j++) {
        stiffness[i * 4 + j]! += w * p.bendingStiffness * curvature[i]! * curvature[j]!
        mass[i * 4 + j]! += w * p.massPerLength * value[i]! * value[j]!
      }
    }
  }
  return { stiffness, mass }
}
