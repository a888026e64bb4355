import { z } from 'zod'
import { SERVICE_KINDS } from '../records/lists'

/** A shipped set booked in for service: what for, when it came in, why, and in what state. */
export const ServiceBookingSchema = z.object({
  kind: z.enum(SERVICE_KINDS, { errorMap: () => ({ message: 'Choose retune or repair' }) }),
  receivedOn: z.string({ required_error: 'Give the date the set came in' }).regex(/^\d{4}-\d{2}-\d{2}$/, 'Write the date received as YYYY-MM-DD')
    .refine(d => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d), 'That date does not exist'),
  reason: z.string({ required_error: 'Say why the set came back' }).trim().min(5, 'Give a reason of at least 5 characters').max(1000, 'A reason is at most 1000 characters'),
  conditions: z.string().trim().max(2000, 'The conditions are at most 2000 characters').default(''),
})
export type ServiceBooking = z.infer<typeof ServiceBookingSchema>
