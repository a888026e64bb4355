import { z } from 'zod'
import { blankModeShape, blankShape, checkDensity } from './blankGrade'
import { BarMaterialSchema } from './pieceGeometry'

/** POST /api/blanks: a graded blank recorded for the workshop, against its lot when given. */
export const BlankRecordInputSchema = z.object({
  ...blankShape,
  ...blankModeShape,
  species: BarMaterialSchema,
  lotId: z.string({ invalid_type_error: 'lotId must be a lot\'s id' }).uuid('That is not a valid lot id').optional(),
}).strict().superRefine(checkDensity)
export type BlankRecordInput = z.infer<typeof BlankRecordInputSchema>

/** GET /api/blanks: the workshop's blanks, of one species and one lot when given. */
export const BlankListQuerySchema = z.object({
  species: BarMaterialSchema.optional(),
  lotId: z.string().uuid('That is not a valid lot id').optional(),
}).strict()
export type BlankListQuery = z.infer<typeof BlankListQuerySchema>

/** POST /api/blanks/{id}/piece: the piece a blank becomes. */
export const BlankToPieceSchema = z.object({ pieceId: z.string({ required_error: 'Give the piece\'s id' }).uuid('That is not a valid piece id') }).strict()
