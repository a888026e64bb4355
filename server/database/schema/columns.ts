/**
 * Column shapes most tables repeat, declared once. Functions, because a column belongs
 * to one table; declarations, because accounts.ts imports this file while this file
 * refers to its tables (only lazily, inside `references`).
 */
import { timestamp, uuid } from 'drizzle-orm/pg-core'
import { users, workshops } from './accounts'

/** A random UUID key. */
export function recordId() {
  return uuid('id').primaryKey().defaultRandom()
}

/** Every instant is stored with its time zone. */
export function instant(name: string) {
  return timestamp(name, { withTimezone: true })
}

/** When the row was made. */
export function createdAt() {
  return instant('created_at').notNull().defaultNow()
}

/** A workshop's record: its key and its workshop (deleting the workshop deletes the record). */
export function workshopRecord() {
  return {
    id: recordId(),
    workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  }
}

/** A person the row names; the row stays (with no one named) when the account is deleted. */
export function personRef(name: string) {
  return uuid(name).references(() => users.id, { onDelete: 'set null' })
}
