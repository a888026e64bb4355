import { z } from 'zod'

/** `?page=&pageSize=` of a timeline, newest first. */
export const TimelineQuerySchema = z.object({
  page: z.coerce.number({ invalid_type_error: 'page must be a number' }).int('page must be a whole number').min(1, 'page starts at 1').max(100000, 'page is too large').default(1),
  pageSize: z.coerce.number({ invalid_type_error: 'pageSize must be a number' }).int('pageSize must be a whole number').min(1, 'pageSize is at least 1').max(100, 'pageSize is at most 100').default(20),
})
export type TimelineQuery = z.infer<typeof TimelineQuerySchema>
