import { z } from 'zod'

/** How the review queue can be grouped (kept in the page's URL with the filters). */
export const REVIEW_GROUPINGS = ['set', 'benchmaker'] as const
export type ReviewGrouping = (typeof REVIEW_GROUPINGS)[number]

/** Strikes of each queued piece whose worst cents the queue shows, newest kept. */
export const REVIEW_TRAIL_STRIKES = 8

/** GET /api/review?set=&benchmaker=&group=: `benchmaker` is the piece's assignee, or `none` for unassigned pieces. */
export const ReviewQuerySchema = z.object({
  set: z.string({ invalid_type_error: 'Choose one set' }).uuid('Choose a set').optional(),
  benchmaker: z.union([z.string({ invalid_type_error: 'Choose one benchmaker' }).uuid('Choose a benchmaker'), z.literal('none')]).optional(),
  group: z.enum(REVIEW_GROUPINGS, { errorMap: () => ({ message: `Group by one of: ${REVIEW_GROUPINGS.join(', ')}` }) }).optional(),
})
export type ReviewQuery = z.infer<typeof ReviewQuerySchema>
