import { GAUSS_POINTS, GAUSS_WEIGHTS } from './gaussLegendre'
import { sectionProperties } from './sectionProperties'

/**
 * Stiffness and consistent mass matrices (4 × 4, row-major) of a two-node Timoshenko beam
 * element (shear deformation and rotary inertia) with shear parameter φ = 12 EI / (κ G A l²),
 * in the standard closed form (Przemieniecki, Theory of Matrix Structural Analysis, §5.6
 * and §11.4; from memory). The section is averaged over the element (thickness linear).
 */
export function timoshenkoElement(startThicknessM: number, endThicknessM: number, lengthM: number, section: { widthM: number, densityKgM3: number, youngsModulusPa: number, shearModulusPa: number, shearCoefficient: number }): { stiffness: Float64Array, mass: Float64Array } {
  if (!(lengthM > 0) || !(section.shearModulusPa > 0) || !(section.shearCoefficient > 0)) throw new RangeError('Timoshenko element needs a positive length, shear modulus and coefficient')
  let ei = 0
  let rhoA = 0
  let rhoI = 0
  let kga = 0
  for (let g = 0; g < GAUSS_POINTS.length; g++) {
    const h = startThicknessM + (endThicknessM - startThicknessM) * GAUSS_POINTS[g]!
    const p = sectionProperties(h, section.widthM, section.densityKgM3, section.youngsModulusPa)
    const w = GAUSS_WEIGHTS[g]!
    ei += w * p.bendingStiffness
    rhoA += w * p.massPerLength
    rhoI += w * p.rotaryInertia
    kga += w * section.shearCoefficient * section.shearModulusPa * section.widthM * h
  }
  const l = lengthM
  const f = 12 * ei / (kga * l * l)
  const k = ei / ((1 + f) * l ** 3)
  const stiffness = symmetric([
    12, 6 * l, -12, 6 * l,
    (4 + f) * l * l, -6 * l, (2 - f) * l * l,
    12, -6 * l,
    (4 + f) * l * l,
  ], k)
  const t = rhoA * l / (1 + f) ** 2
  const a = 13 / 35 + 7 * f / 10 + f * f / 3
  const b = (11 / 210 + 11 * f / 120 + f * f / 24) * l
  const c = 9 / 70 + 3 * f / 10 + f * f / 6
  const d = (13 / 420 + 3 * f / 40 + f * f / 24) * l
  const e = (1 / 105 + f / 60 + f * f / 120) * l * l
  const g = (1 / 140 + f / 60 + f * f / 120) * l * l
  const translational = symmetric([a, b, c, -d, e, d, -g, a, -b, e], t)
  const r = rhoI / ((1 + f) ** 2 * l)
  const p = (1 / 10 - f / 2) * l
  const q = (2 / 15 + f / 6 + f * f / 3) * l * l
  const s = (-1 / 30 - f / 6 + f * f / 6) * l * l
  const rotary = symmetric([6 / 5, p, -6 / 5, p, q, -p, s, 6 / 5, -p, q], r)
  const mass = translational.map((v, i) => v + rotary[i]!)
  return { stiffness, mass }
}

/** A 4 × 4 symmetric matrix from its upper triangle (row by row), times a factor. */
function symmetric(upper: number[], factor: number): Float64Array {
  const out = new Float64Array(16)
  let n = 0
  for (let i = 0; i < 4; i++) {
    for (let j = i; j < 4; j++) {
      out[i * 4 + j] = upper[n]! * factor
      out[j * 4 + i] = upper[n++]! * factor
    }
  }
  return out
}
