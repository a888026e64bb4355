import { z } from 'zod'
import { CUT_PLAN_LIMITS, within } from './cutPlan'

/** Limits of a blank-grade request; the dimensions share the cut plan's. */
export const BLANK_GRADE_LIMITS = {
  massG: [0.1, 100_000],
  f1Hz: [1, 50_000],
  decayDbPerS: [0, 10_000],
} as const

const L = { ...CUT_PLAN_LIMITS, ...BLANK_GRADE_LIMITS }

export const BlankGradeInputSchema = z.object({
  lengthMm: within('the length', L.lengthMm, ' mm'),
  widthMm: within('the width', L.widthMm, ' mm'),
  thicknessMm: within('the thickness', L.thicknessMm, ' mm'),
  massG: within('the mass', L.massG, ' g'),
  f1Hz: within('the first mode\'s frequency', L.f1Hz, ' Hz'),
  decayDbPerS: within('the decay rate', L.decayDbPerS, ' dB/s').optional(),
}).strict().superRefine((blank, context) => {
  const densityKgM3 = (blank.massG * 1e6) / (blank.lengthMm * blank.widthMm * blank.thicknessMm)
  if (densityKgM3 < L.densityKgM3[0] || densityKgM3 > L.densityKgM3[1]) {
    context.addIssue({ code: z.ZodIssueCode.custom, path: ['massG'], message: `These dimensions and mass make ${Math.round(densityKgM3)} kg/m³, which no blank is: check them` })
  }
})
export type BlankGradeInput = z.infer<typeof BlankGradeInputSchema>
