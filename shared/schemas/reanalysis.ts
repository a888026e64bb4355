import { z } from 'zod'

/** Most strikes one re-measurement takes on (a set of about 60 pieces with many strikes each still fits). */
export const MAX_REANALYSIS_STRIKES = 3000

/** Body of POST /api/pieces/:id/reanalyze and POST /api/sets/:id/reanalyze (optional). */
export const ReanalyzeSchema = z.object({
  reason: z.string({ invalid_type_error: 'The reason must be text' }).trim().max(500, 'The reason is at most 500 characters').default(''),
}).strict().default({})
export type ReanalyzeInput = z.infer<typeof ReanalyzeSchema>

/** Query of GET /api/reanalysis: exactly one of `set` or `piece`. */
export const LatestReanalysisQuery = z.object({
  set: z.string().uuid('That is not a valid set id').optional(),
  piece: z.string().uuid('That is not a valid piece id').optional(),
}).refine(q => (q.set ? 1 : 0) + (q.piece ? 1 : 0) === 1, 'Give either a set or a piece')
export type LatestReanalysisInput = z.infer<typeof LatestReanalysisQuery>
