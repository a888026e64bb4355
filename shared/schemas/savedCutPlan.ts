import { z } from 'zod'

/** POST /api/pieces/{id}/cut-plans: plan from a given strike of the piece, or (empty body) from its latest. */
export const CutPlanRequestSchema = z.object({
  strikeId: z.string({ invalid_type_error: 'strikeId must be a strike\'s id' }).uuid('That is not a valid strike id').optional(),
}).strict().nullish().transform(body => body ?? {})
export type CutPlanRequest = z.infer<typeof CutPlanRequestSchema>
