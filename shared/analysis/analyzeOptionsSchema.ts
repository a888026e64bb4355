import { z } from 'zod'
import { parseNoteName } from './parseNoteName'

const finite = (what: string) => z.number({ invalid_type_error: `${what} must be a number.` }).finite(`${what} must be a number.`)

export const TemplatePartialSpecSchema = z.object({
  label: z.string().trim().min(1, 'Every template partial needs a label.').max(60, 'A partial label may have at most 60 characters.'),
  ratio: finite('A partial ratio').positive('A partial ratio must be greater than 0.').max(100, 'A partial ratio may be at most 100.'),
  toleranceCents: finite('A tolerance').positive('A tolerance must be greater than 0 ¢.').max(1200, 'A tolerance may be at most 1200 ¢.'),
  required: z.boolean({ invalid_type_error: 'Whether a partial is required must be true or false.' }),
})

const searchWindowCents = finite('The search window').positive('The search window must be greater than 0 ¢.').max(1200, 'The search window may be at most 1200 ¢.')
const referenceTemperatureC = finite('The reference temperature').min(-40, 'The reference temperature must be between −40 and 80 °C.').max(80, 'The reference temperature must be between −40 and 80 °C.')
const temperatureCoefficientCentsPerC = finite('The temperature coefficient').min(-50, 'The temperature coefficient must be between −50 and 50 ¢/°C.').max(50, 'The temperature coefficient must be between −50 and 50 ¢/°C.')

export const RatioTemplateSchema = z.object({
  partials: z.array(TemplatePartialSpecSchema).min(1, 'A template needs at least one partial.').max(32, 'A template may have at most 32 partials.'),
  searchWindowCents: searchWindowCents.optional(),
  referenceTemperatureC: referenceTemperatureC.optional(),
  temperatureCoefficientCentsPerC: temperatureCoefficientCentsPerC.optional(),
})

/** The fields of AnalyzeOptions as a plain object schema (to extend or pick from). */
export const AnalyzeOptionsObjectSchema = z.object({
  note: z
    .string()
    .refine(n => parseNoteName(n) !== null, { message: 'The note must be a note name such as C4, F#3 or Bb2.' })
    .optional(),
  targetHz: finite('The target frequency').min(10, 'The target frequency must be between 10 and 20000 Hz.').max(20000, 'The target frequency must be between 10 and 20000 Hz.').optional(),
  referenceHz: finite('The reference pitch').min(400, 'The reference pitch must be between 400 and 480 Hz.').max(480, 'The reference pitch must be between 400 and 480 Hz.').optional(),
  ratios: z.array(TemplatePartialSpecSchema.shape.ratio).min(1, 'Give at least one ratio.').max(32, 'Give at most 32 ratios.').optional(),
  tolerances: z.array(TemplatePartialSpecSchema.shape.toleranceCents).min(1, 'Give at least one tolerance.').optional(),
  labels: z.array(TemplatePartialSpecSchema.shape.label).optional(),
  required: z.array(z.boolean()).optional(),
  searchWindowCents: searchWindowCents.optional(),
  referenceTemperatureC: referenceTemperatureC.optional(),
  temperatureCoefficientCentsPerC: temperatureCoefficientCentsPerC.optional(),
  temperatureC: finite('The bench temperature').min(-40, 'The bench temperature must be between −40 and 80 °C.').max(80, 'The bench temperature must be between −40 and 80 °C.').optional(),
  template: RatioTemplateSchema.optional(),
  attackSkipS: finite('The attack skip').min(0, 'The attack skip must be between 0 and 0.5 s.').max(0.5, 'The attack skip must be between 0 and 0.5 s.').optional(),
  windowS: finite('The window length').min(0.01, 'The window length must be between 0.01 and 2 s.').max(2, 'The window length must be between 0.01 and 2 s.').optional(),
  clockOffsetPpm: finite('The clock offset').min(-10000, 'The clock offset must be between −10 000 and 10 000 ppm.').max(10000, 'The clock offset must be between −10 000 and 10 000 ppm.').optional(),
})

/** Options of one analysis, validated; every message is one plain sentence. */
export const AnalyzeOptionsSchema = AnalyzeOptionsObjectSchema
  .strict()
  .superRefine((o, ctx) => {
    const count = o.ratios?.length ?? 1
    const mismatch = (what: string, n: number | undefined, allowOne: boolean) => {
      if (n === undefined || n === count || (allowOne && n === 1)) return
      ctx.addIssue({ code: z.ZodIssueCode.custom, message: `Give one ${what} per ratio (${count} ${count === 1 ? 'ratio' : 'ratios'}, ${n} ${what}s).` })
    }
    mismatch('tolerance', o.tolerances?.length, true)
    mismatch('label', o.labels?.length, false)
    mismatch('required flag', o.required?.length, false)
    const hasTarget = o.note !== undefined || o.targetHz !== undefined
    if (!hasTarget && (o.ratios || o.tolerances || o.template)) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, message: 'Ratios and tolerances need a target: give a note or a target frequency.' })
    }
  })
