import { BAR_MATERIALS, type BarMaterial } from '../records/barMaterials'
import { CUT_PLAN_LIMITS } from '../schemas/cutPlan'
import type { TemplateFamily } from '../records/lists'
import { solveBarModes } from './solveBarModes'
import type { BarGeometry, ProfileStation } from './types'

/**
 * The starting section and shape of each family the bar model covers, from memory of
 * common practice: marimba and xylophone bars about 50 mm wide, wooden ones about 22 mm
 * thick and metal ones about 13 mm, undercut in an arch over the middle 60 % to about half
 * their thickness; glockenspiel plates 25 mm wide, 8 mm thick and flat.
 */
const FAMILY_SHAPES = {
  bar: { widthMm: 50, woodThicknessMm: 22, metalThicknessMm: 13, archFrom: 0.2, archDepth: 0.5 },
  plate: { widthMm: 25, woodThicknessMm: 10, metalThicknessMm: 8, archFrom: 0.5, archDepth: 0 },
} as const
export type ModelledFamily = keyof typeof FAMILY_SHAPES
const WOODS: readonly BarMaterial[] = ['rosewood', 'padauk']
/** Stations of the arch as fractions of the length. */
const ARCH_STATIONS = 17

/** The material a family is usually cut from, when nothing better is known (from memory). */
export const FAMILY_MATERIAL: Record<ModelledFamily, BarMaterial> = { bar: 'rosewood', plate: 'aluminium' }

export function isModelledFamily(family: TemplateFamily): family is ModelledFamily {
  return family in FAMILY_SHAPES
}

/** The family's profile at length `lengthMm` and thickness `thicknessMm` (a raised-cosine arch under the middle). */
function familyProfile(family: ModelledFamily, lengthMm: number, thicknessMm: number): ProfileStation[] {
  const { archFrom, archDepth } = FAMILY_SHAPES[family]
  if (archDepth === 0) return [{ xMm: 0, thicknessMm }, { xMm: lengthMm, thicknessMm }]
  const stations = Array.from({ length: ARCH_STATIONS }, (_, i) => {
    const u = i / (ARCH_STATIONS - 1)
    const inArch = Math.max(0, 1 - Math.abs(u - 0.5) / (0.5 - archFrom))
    const depth = archDepth * 0.5 * (1 - Math.cos(Math.PI * inArch))
    return { xMm: Math.round(u * lengthMm * 100) / 100, thicknessMm: Math.round(thicknessMm * (1 - depth) * 100) / 100 }
  })
  // Mirror the left half exactly, so the planner sees a symmetric bar and plans mirrored cuts.
  return stations.map((s, i) => (i <= (ARCH_STATIONS - 1) / 2 ? s : { ...stations[ARCH_STATIONS - 1 - i]!, xMm: lengthMm - stations[ARCH_STATIONS - 1 - i]!.xMm }))
}

/** f₁ · L² / (h · √(E/ρ)) of a family's shape: a constant of the shape alone under Euler–Bernoulli, so one solve serves every note. */
const shapeConstants = new Map<ModelledFamily, number>()
function shapeConstant(family: ModelledFamily): number {
  const known = shapeConstants.get(family)
  if (known !== undefined) return known
  // A probe of 1 m and 20 mm in a material with √(E/ρ) = √(10 GPa / 1000 kg/m³).
  const probe = { lengthMm: 1000, widthMm: 50, profile: familyProfile(family, 1000, 20), densityKgM3: 1000, youngsModulusGPa: 10 }
  const f1 = solveBarModes(probe, { modes: 1 }).frequenciesHz[0]!
  const constant = (f1 * 1 ** 2) / (0.020 * Math.sqrt(10e9 / 1000))
  shapeConstants.set(family, constant)
  return constant
}

/**
 * A piece's default geometry from its register: the family's shape in the material, at the
 * length that puts the model's first bending mode on the note's target frequency (f₁ ∝ h / L²
 * for a shape scaled along its length). Throws a RangeError with a plain sentence when the
 * note needs a bar longer or shorter than the model takes.
 */
export function defaultBarGeometry(
  family: ModelledFamily, targetHz: number, material: BarMaterial,
  measured?: { densityKgM3: number, youngsModulusGPa: number },
): BarGeometry & { profile: ProfileStation[] } {
  if (!(Number.isFinite(targetHz) && targetHz > 0)) throw new RangeError('The target frequency must be a positive number of hertz.')
  const shape = FAMILY_SHAPES[family]
  // A graded blank's own figures, else the material's typical ones.
  const { densityKgM3, youngsModulusGPa } = measured ?? BAR_MATERIALS[material]
  const thicknessMm = WOODS.includes(material) ? shape.woodThicknessMm : shape.metalThicknessMm
  const lengthM = Math.sqrt((shapeConstant(family) * (thicknessMm / 1000) * Math.sqrt((youngsModulusGPa * 1e9) / densityKgM3)) / targetHz)
  const lengthMm = Math.round(lengthM * 10_000) / 10
  const [shortest, longest] = CUT_PLAN_LIMITS.lengthMm
  if (lengthMm < shortest || lengthMm > longest) {
    throw new RangeError(`A ${family} of ${material} at ${targetHz.toFixed(1)} Hz would be ${lengthMm.toFixed(0)} mm long, outside the ${shortest}–${longest} mm the model takes: enter its geometry by hand.`)
  }
  return { lengthMm, widthMm: shape.widthMm, profile: familyProfile(family, lengthMm, thicknessMm), densityKgM3, youngsModulusGPa }
}
