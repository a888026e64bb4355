import { z } from 'zod'
import { parseNoteName } from '../analysis/parseNoteName'
import { COMPOSITE_MOVES, isCompositeMove, PIECE_STAGES } from '../records/stages'
import { PIECE_VERDICTS, TEMPLATE_FAMILIES } from '../records/lists'
import { wordsOr } from '../format/words'
import { permitProblem } from '../records/listedTimber'
import { DECISION_RULES } from '../uncertainty/types'

export const finite = (what: string) => z.number({ required_error: `Enter ${what}`, invalid_type_error: `${what} must be a number` }).finite(`${what} must be a number`)

export const TemplatePartialInputSchema = z.object({
  label: z.string().trim().min(1, 'Name each partial').max(60, 'A partial name is at most 60 characters'),
  ratio: finite('the ratio').gt(0, 'A ratio must be above 0').max(40, 'A ratio must be at most 40'),
  toleranceCents: finite('the tolerance').gt(0, 'A tolerance must be above 0 ¢').max(100, 'A tolerance must be at most 100 ¢'),
  required: z.boolean().default(true),
})

export const TemplateInputSchema = z.object({
  family: z.enum(TEMPLATE_FAMILIES, { errorMap: () => ({ message: `Choose a family: ${wordsOr(TEMPLATE_FAMILIES)}` }) }),
  name: z.string().trim().min(2, 'Name the template').max(120, 'A template name is at most 120 characters'),
  partials: z.array(TemplatePartialInputSchema).min(1, 'A template needs at least one partial').max(12, 'A template has at most 12 partials')
    .refine(ps => new Set(ps.map(p => p.ratio)).size === ps.length, 'Two partials have the same ratio'),
  searchWindowCents: finite('the search window').min(5, 'The search window must be at least 5 ¢').max(600, 'The search window must be at most 600 ¢').default(80),
  referenceTemperatureC: finite('the reference temperature').min(-10, 'The reference temperature must be between −10 and 50 °C').max(50, 'The reference temperature must be between −10 and 50 °C').default(20),
  temperatureCoefficientCentsPerC: finite('the temperature coefficient').min(-10, 'The temperature coefficient must be between −10 and 10 ¢/°C').max(10, 'The temperature coefficient must be between −10 and 10 ¢/°C').default(0),
  decisionRule: z.enum(DECISION_RULES, { errorMap: () => ({ message: `Choose a decision rule: ${wordsOr(DECISION_RULES)}` }) }).default('simple'),
  notes: z.string().max(2000, 'Notes are at most 2000 characters').default(''),
  source: z.string().max(2000, 'The source is at most 2000 characters').default(''),
})
export type TemplateInput = z.infer<typeof TemplateInputSchema>

export const NoteSchema = z.string({ required_error: 'Enter a note' }).trim()
  .refine(n => parseNoteName(n) !== null, 'Write the note like C4, F#3 or Bb2')

export const BuyerSchema = z.object({
  name: z.string({ required_error: 'Enter the buyer\'s name' }).trim().min(1, 'Enter the buyer\'s name').max(120, 'The buyer\'s name is at most 120 characters'),
  organisation: z.string().trim().max(160, 'The organisation is at most 160 characters').default(''),
  email: z.string({ required_error: 'Enter the buyer\'s e-mail' }).trim().toLowerCase().email('Enter a valid e-mail address for the buyer'),
})

export const RegisterSchema = z.object({ fromNote: NoteSchema, toNote: NoteSchema, templateId: z.string().uuid('Choose a template') })

export const CreateSetSchema = z.object({
  name: z.string({ required_error: 'Name the set' }).trim().min(1, 'Name the set').max(120, 'A set name is at most 120 characters'),
  model: z.string({ required_error: 'Enter the model' }).trim().min(1, 'Enter the model').max(120, 'The model is at most 120 characters'),
  serial: z.string({ required_error: 'Enter the serial number' }).trim().min(1, 'Enter the serial number').max(60, 'The serial number is at most 60 characters'),
  buyer: BuyerSchema,
  referenceHz: finite('the reference pitch').min(400, 'The reference pitch must be between 400 and 480 Hz').max(480, 'The reference pitch must be between 400 and 480 Hz').default(440),
  temperament: z.literal('equal').default('equal'),
  noteOffsetsCents: z.record(NoteSchema, finite('a note offset').min(-100, 'A note offset must be within ±100 ¢').max(100, 'A note offset must be within ±100 ¢')).default({}),
  fromNote: NoteSchema,
  toNote: NoteSchema,
  chromatic: z.boolean().default(true),
  templateId: z.string({ required_error: 'Choose a template' }).uuid('Choose a template'),
  registers: z.array(RegisterSchema).max(12, 'At most 12 registers').default([]),
  dueOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Write the due date as YYYY-MM-DD').nullish(),
})
export type CreateSetInput = z.infer<typeof CreateSetSchema>

const stage = z.enum(PIECE_STAGES, { errorMap: () => ({ message: `Choose a stage: ${wordsOr(PIECE_STAGES)}` }) })
const verdict = z.enum([...PIECE_VERDICTS, 'none'], { errorMap: () => ({ message: `Choose a verdict: ${wordsOr([...PIECE_VERDICTS, 'none'])}` }) })

export const PIECE_SORTS = ['position', '-position', 'note', '-note', 'stage', '-stage', 'updated', '-updated', 'cents', '-cents', 'strikes', '-strikes'] as const

export const PieceQuerySchema = z.object({
  set: z.string().uuid('Choose a set').optional(),
  stage: z.union([stage, z.array(stage)]).optional().transform(v => v === undefined ? undefined : Array.isArray(v) ? v : [v]),
  verdict: verdict.optional(),
  assignee: z.union([z.string().uuid('Choose an assignee'), z.literal('me'), z.literal('none')]).optional(),
  q: z.string().trim().max(60, 'Search for at most 60 characters').optional(),
  sort: z.enum(PIECE_SORTS, { errorMap: () => ({ message: `Sort by one of: ${PIECE_SORTS.join(', ')}` }) }).default('position'),
  page: z.coerce.number({ invalid_type_error: 'page must be a number' }).int('page must be a whole number').min(1, 'page starts at 1').max(100000, 'page is too large').default(1),
  pageSize: z.coerce.number({ invalid_type_error: 'pageSize must be a number' }).int('pageSize must be a whole number').min(1, 'pageSize is at least 1').max(200, 'pageSize is at most 200').default(50),
})
export type PieceQuery = z.infer<typeof PieceQuerySchema>

const COMPOSITE_MOVE_NAMES = Object.entries(COMPOSITE_MOVES).map(([to, via]) => `${to} through ${via}`).join(', ')
/** Scrapping is final for the piece and the audit keeps why: it needs a reason of a few words. */
export const SCRAP_REASON_MIN = 3
const SCRAP_REASON = { message: 'Say why the piece is scrapped (a reason of at least 3 characters)', path: ['reason'] }
function hasReasonWhereNeeded(b: { to: string, reason?: string }) {
  return b.to !== 'scrapped' || (b.reason ?? '').length >= SCRAP_REASON_MIN
}
// `via`: a composite move of the stage table (review through tuning), made in one transaction.
export const StageChangeSchema = z.object({
  to: stage,
  via: stage.optional(),
  reason: z.string().trim().max(500, 'A reason is at most 500 characters').optional(),
}).refine(b => !b.via || isCompositeMove(b.to, b.via), { message: `A move through another stage is one of: ${COMPOSITE_MOVE_NAMES}`, path: ['via'] })
  .refine(hasReasonWhereNeeded, SCRAP_REASON)
export const BulkStageSchema = z.object({
  pieceIds: z.array(z.string().uuid('A piece id is not valid')).min(1, 'Choose at least one piece').max(200, 'Change at most 200 pieces at once'),
  to: stage,
  reason: z.string().trim().max(500, 'A reason is at most 500 characters').optional(),
}).refine(hasReasonWhereNeeded, SCRAP_REASON)
export const ApproveSchema = z.object({
  strikeId: z.string({ required_error: 'Say which strike the approval rests on' }).uuid('That is not a strike id'),
  overrideReason: z.string().trim().min(5, 'Give a reason of at least 5 characters for the override').max(500, 'A reason is at most 500 characters').optional(),
  comment: z.string().trim().max(1000, 'A comment is at most 1000 characters').optional(),
})
export const RETURN_REASON_MAX = 1000
export const ReturnSchema = z.object({ comment: z.string({ required_error: 'Say what needs rework', invalid_type_error: 'Say what needs rework, in words' }).trim().min(3, 'Say what needs rework').max(RETURN_REASON_MAX, `A comment is at most ${RETURN_REASON_MAX} characters`) })
export const ReopenSchema = z.object({ reason: z.string({ required_error: 'Give the reason for reopening' }).trim().min(5, 'Give a reason of at least 5 characters').max(500, 'A reason is at most 500 characters') })
export const AssignSchema = z.object({ assigneeId: z.string().uuid('Choose a member').nullable() })

const emptyAsNull = (v: unknown) => (v === '' ? null : v)

/** A lot's fields; a listed timber species needs its permit number (shared/records/listedTimber.ts). */
export const LotFieldsSchema = z.object({
  code: z.string().trim().min(1, 'Give the lot a code').max(40, 'A lot code is at most 40 characters'),
  material: z.string().trim().min(1, 'Name the material').max(80, 'The material is at most 80 characters'),
  species: z.string().trim().max(120, 'The species or alloy is at most 120 characters').default(''),
  supplier: z.string().trim().max(160, 'The supplier is at most 160 characters').default(''),
  // An empty field of a form means "not recorded".
  receivedOn: z.preprocess(emptyAsNull, z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Write the date received as YYYY-MM-DD').nullish()),
  moisturePct: z.preprocess(emptyAsNull, finite('the moisture content').min(0, 'Moisture content must be between 0 and 100 %').max(100, 'Moisture content must be between 0 and 100 %').nullish()),
  permitNumber: z.string().trim().max(80, 'A permit number is at most 80 characters').default(''),
  documents: z.string().max(2000, 'Documents are at most 2000 characters').default(''),
  notes: z.string().max(2000, 'Notes are at most 2000 characters').default(''),
})
const permitRule = (lot: { species?: string, permitNumber?: string }, ctx: z.RefinementCtx) => {
  const problem = permitProblem(lot.species ?? '', lot.permitNumber ?? '')
  if (problem) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['permitNumber'], message: problem })
}
export const LotInputSchema = LotFieldsSchema.superRefine(permitRule)
/** An edit names only the fields it changes; the service checks the permit rule on the merged lot. */
export const LotPatchSchema = LotFieldsSchema.partial().refine(p => Object.keys(p).length > 0, 'Change at least one field of the lot')
export type LotPatch = z.infer<typeof LotPatchSchema>
export type LotInput = z.infer<typeof LotInputSchema>

/** Multipart fields of a strike upload (strings, as forms send them). */
export const StrikeFieldsSchema = z.object({
  temperatureC: z.coerce.number({ invalid_type_error: 'The temperature must be a number in °C' }).min(-10, 'The bench temperature must be between −10 and 50 °C').max(50, 'The bench temperature must be between −10 and 50 °C').optional(),
  humidityPct: z.coerce.number({ invalid_type_error: 'The humidity must be a number in %' }).min(0, 'Humidity must be between 0 and 100 %').max(100, 'Humidity must be between 0 and 100 %').optional(),
})

/** Pieces made from one lot: at most a few sets' worth in one request. */
export const LotAssignSchema = z.object({
  pieceIds: z.array(z.string().uuid('That is not a valid piece id'), { required_error: 'List the pieces' }).min(1, 'List at least one piece').max(500, 'At most 500 pieces at a time'),
})
