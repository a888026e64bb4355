/** Service records: a shipped set booked back in for retuning or repair. */
import { sql } from 'drizzle-orm'
import { index, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { createdAt, instant, personRef, workshopRecord } from './columns'
import { SERVICE_KINDS } from '../../../shared/records/lists'
import { sets } from './records'
import { certificates } from './certificates'

/**
 * One visit of a set: its pieces re-enter tuning under it, and the certificate signed
 * when they are approved again supersedes the one it came in with and closes the record.
 */
export const serviceRecords = pgTable('service_records', {
  ...workshopRecord(),
  setId: uuid('set_id').notNull().references(() => sets.id, { onDelete: 'cascade' }),
  kind: text('kind', { enum: SERVICE_KINDS }).notNull(),
  receivedOn: text('received_on').notNull(),
  reason: text('reason').notNull(),
  conditions: text('conditions').notNull().default(''),
  previousCertificateId: uuid('previous_certificate_id').references(() => certificates.id, { onDelete: 'set null' }),
  certificateId: uuid('certificate_id').references(() => certificates.id, { onDelete: 'set null' }),
  bookedBy: personRef('booked_by'),
  createdAt: createdAt(),
  closedAt: instant('closed_at'),
}, t => [
  index('service_records_set_idx').on(t.workshopId, t.setId, t.createdAt),
  // One open visit per set: two bookings racing meet here (and at the set's row lock first).
  uniqueIndex('service_records_set_open_key').on(t.setId).where(sql`${t.closedAt} is null`),
])

export type ServiceRecord = typeof serviceRecords.$inferSelect
