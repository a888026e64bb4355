import { z } from 'zod'
import { capitalised } from '../format/words'
import { finite } from './records'

/** Limits of a cut-plan request: each keeps the model's work bounded and the figures physical. */
export const CUT_PLAN_LIMITS = {
  lengthMm: [20, 3000],
  widthMm: [2, 500],
  thicknessMm: [0.5, 200],
  profileStations: 64,
  densityKgM3: [100, 25000],
  youngsModulusGPa: [0.1, 500],
  partials: 4,
  ratio: [0.5, 40],
  cents: 1200,
  toleranceCents: [0.1, 100],
  maxDepthMm: [0.05, 50],
} as const

const L = CUT_PLAN_LIMITS
/** A finite number within a range, with one sentence naming the range and unit. */
export const within = (what: string, [lo, hi]: readonly [number, number], unit: string) =>
  finite(what).min(lo, `${capitalised(what)} must be between ${lo} and ${hi}${unit}`).max(hi, `${capitalised(what)} must be between ${lo} and ${hi}${unit}`)

export const ProfileStationSchema = z.object({
  xMm: finite('the position').min(0, 'A position must be at least 0 mm').max(L.lengthMm[1], `A position must be at most ${L.lengthMm[1]} mm`),
  thicknessMm: within('the thickness', L.thicknessMm, ' mm'),
}).strict()

/** A profile must run from 0 mm to the bar's length, left to right: a zod refinement shared by every bar body. */
export function checkProfileEnds(input: { lengthMm: number, profile: { xMm: number }[] }, context: z.RefinementCtx) {
  const p = input.profile
  const add = (message: string) => context.addIssue({ code: z.ZodIssueCode.custom, path: ['profile'], message })
  if (p[0]!.xMm !== 0 || p[p.length - 1]!.xMm !== input.lengthMm) add('The profile must start at 0 mm and end at the bar\'s length')
  else if (p.some((s, i) => i > 0 && !(s.xMm > p[i - 1]!.xMm))) add('Profile stations must go from left to right without repeats')
}

export const ProfileSchema = z.array(ProfileStationSchema, { required_error: 'Give the thickness profile' })
  .min(2, 'The profile needs at least two stations').max(L.profileStations, `The profile has at most ${L.profileStations} stations`)

export const CutPlanPartialSchema = z.object({
  ratio: within('the ratio', L.ratio, ''),
  cents: within('the deviation', [-L.cents, L.cents], ' ¢'),
  toleranceCents: within('the tolerance', L.toleranceCents, ' ¢'),
}).strict()

export const CutPlanInputSchema = z.object({
  lengthMm: within('the length', L.lengthMm, ' mm'),
  widthMm: within('the width', L.widthMm, ' mm'),
  profile: ProfileSchema,
  densityKgM3: within('the density', L.densityKgM3, ' kg/m³'),
  youngsModulusGPa: within('Young\'s modulus', L.youngsModulusGPa, ' GPa'),
  partials: z.array(CutPlanPartialSchema, { required_error: 'Give the measured partials' })
    .min(1, 'Give at least one partial').max(L.partials, `At most ${L.partials} partials can be planned for`)
    .refine(ps => new Set(ps.map(p => p.ratio)).size === ps.length, 'Two partials have the same ratio'),
  maxDepthMm: within('the maximum depth', L.maxDepthMm, ' mm').optional(),
  minThicknessMm: within('the minimum thickness', L.thicknessMm, ' mm').optional(),
}).strict().superRefine(checkProfileEnds)
export type CutPlanInput = z.infer<typeof CutPlanInputSchema>

export const CutPlanSchema = z.object({
  modesHz: z.array(z.number()),
  stations: z.array(z.object({ xMm: z.number(), depthMm: z.number() })),
  predicted: z.array(z.object({ ratio: z.number(), centsBefore: z.number(), centsAfter: z.number() })),
  feasible: z.boolean(),
  note: z.string().optional(),
})
export type CutPlan = z.infer<typeof CutPlanSchema>
