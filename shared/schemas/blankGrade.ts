import { z } from 'zod'
import { BarMaterialSchema } from './pieceGeometry'
import { CUT_PLAN_LIMITS, within } from './cutPlan'

/** Limits of a blank-grade request; the dimensions share the cut plan's. */
export const BLANK_GRADE_LIMITS = {
  massG: [0.1, 100_000],
  f1Hz: [1, 50_000],
  decayDbPerS: [0, 10_000],
} as const

const L = { ...CUT_PLAN_LIMITS, ...BLANK_GRADE_LIMITS }

/** A blank's dimensions and mass, and optionally its species (for a grade from the species' thresholds). */
export const blankShape = {
  lengthMm: within('the length', L.lengthMm, ' mm'),
  widthMm: within('the width', L.widthMm, ' mm'),
  thicknessMm: within('the thickness', L.thicknessMm, ' mm'),
  massG: within('the mass', L.massG, ' g'),
  species: BarMaterialSchema.optional(),
}

export function checkDensity(blank: { lengthMm: number, widthMm: number, thicknessMm: number, massG: number }, context: z.RefinementCtx) {
  const densityKgM3 = (blank.massG * 1e6) / (blank.lengthMm * blank.widthMm * blank.thicknessMm)
  if (densityKgM3 < L.densityKgM3[0] || densityKgM3 > L.densityKgM3[1]) {
    context.addIssue({ code: z.ZodIssueCode.custom, path: ['massG'], message: `These dimensions and mass make ${Math.round(densityKgM3)} kg/m³, which no blank is: check them` })
  }
}

/** The first mode and its decay, as measured. */
export const blankModeShape = {
  f1Hz: within('the first mode\'s frequency', L.f1Hz, ' Hz'),
  decayDbPerS: within('the decay rate', L.decayDbPerS, ' dB/s').optional(),
}

export const BlankGradeInputSchema = z.object({ ...blankShape, ...blankModeShape }).strict().superRefine(checkDensity)
export type BlankGradeInput = z.infer<typeof BlankGradeInputSchema>

/**
 * The text fields beside a multipart `file` of a blank's strike: the same figures as the JSON
 * body, typed as text (an empty field counts as absent), without f1 and the decay, which the
 * strike gives.
 */
export const BlankStrikeFieldsSchema = z.preprocess(
  fields => (fields && typeof fields === 'object'
    ? Object.fromEntries(Object.entries(fields).filter(([, v]) => String(v).trim() !== '').map(([k, v]) => [k, k === 'species' ? String(v).trim() : Number(v)]))
    : fields),
  z.object(blankShape).strict().superRefine(checkDensity),
)
export type BlankStrikeFields = z.infer<typeof BlankStrikeFieldsSchema>
