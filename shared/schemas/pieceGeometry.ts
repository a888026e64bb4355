import { z } from 'zod'
import { BAR_MATERIAL_NAMES } from '../records/barMaterials'
import { checkProfileEnds, CUT_PLAN_LIMITS, ProfileSchema, within } from './cutPlan'

const L = CUT_PLAN_LIMITS

/** A piece's geometry and material as stored on the piece (jsonb) and entered by hand: what the bar model needs. */
export const PieceGeometrySchema = z.object({
  lengthMm: within('the length', L.lengthMm, ' mm'),
  widthMm: within('the width', L.widthMm, ' mm'),
  profile: ProfileSchema,
  densityKgM3: within('the density', L.densityKgM3, ' kg/m³'),
  youngsModulusGPa: within('Young\'s modulus', L.youngsModulusGPa, ' GPa'),
}).strict().superRefine(checkProfileEnds)
export type PieceGeometry = z.infer<typeof PieceGeometrySchema>

export const BarMaterialSchema = z.enum(BAR_MATERIAL_NAMES, { errorMap: () => ({ message: `The material is one of ${BAR_MATERIAL_NAMES.join(', ')}` }) })

/** PUT /api/pieces/{id}/geometry: the piece's geometry and material by hand. */
export const PieceGeometryInputSchema = z.object({
  geometry: PieceGeometrySchema,
  material: BarMaterialSchema,
}).strict()
export type PieceGeometryInput = z.infer<typeof PieceGeometryInputSchema>
