import { z } from 'zod'
import type { BlankThreshold } from '../barModel/blankThresholds'
import { BAR_MATERIAL_NAMES, type BarMaterial } from '../records/barMaterials'
import { finite } from './records'

/** The figures a threshold may take: E/ρ in GPa per g/cm³, η a plain ratio. */
export const BLANK_THRESHOLD_LIMITS = { specificModulus: 100, lossFactor: 1 } as const

const positive = (what: string, max: number) => finite(what).gt(0, `${what[0]!.toUpperCase()}${what.slice(1)} must be above 0`).max(max, `${what[0]!.toUpperCase()}${what.slice(1)} must be at most ${max}`)
const pair = (what: string, max: number) => z.object({ select: positive(`the select ${what}`, max), usable: positive(`the usable ${what}`, max) }, { required_error: `Give the ${what} limits` }).strict()

/** One species' limits: a select blank is at least as stiff and at most as lossy as a usable one. */
export const BlankThresholdSchema = z.object({
  specificModulus: pair('E/ρ', BLANK_THRESHOLD_LIMITS.specificModulus),
  lossFactor: pair('loss factor', BLANK_THRESHOLD_LIMITS.lossFactor),
}).strict().superRefine((t, context) => {
  if (t.specificModulus.select < t.specificModulus.usable) {
    context.addIssue({ code: z.ZodIssueCode.custom, path: ['specificModulus'], message: 'The select E/ρ must be at least the usable one' })
  }
  if (t.lossFactor.select > t.lossFactor.usable) {
    context.addIssue({ code: z.ZodIssueCode.custom, path: ['lossFactor'], message: 'The select loss factor must be at most the usable one' })
  }
}) satisfies z.ZodType<BlankThreshold>

/** The workshop's own thresholds: any of the species; a species left out grades by the starting ones. */
export const BlankThresholdsSchema = z.object(
  Object.fromEntries(BAR_MATERIAL_NAMES.map(m => [m, BlankThresholdSchema.optional()])) as Record<BarMaterial, z.ZodOptional<typeof BlankThresholdSchema>>,
  { invalid_type_error: 'The thresholds must be given per species', required_error: 'Send the thresholds per species' },
).strict()
export type BlankThresholds = Partial<Record<BarMaterial, BlankThreshold>>

/** PUT /api/workshops/current/blank-thresholds: the whole set of the workshop's own thresholds. */
export const BlankThresholdsPutSchema = z.object({ thresholds: BlankThresholdsSchema }).strict()
