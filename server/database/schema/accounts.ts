/** Accounts: workshops (the tenants), people, memberships, sessions, sign-in attempts and the audit trail. */
import { sql } from 'drizzle-orm'
import { boolean, doublePrecision, index, integer, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { createdAt, instant, personRef, recordId, workshopRecord } from './columns'
import { ROLES } from '../../../shared/auth/roles'
import { TEMPERATURE_UNITS } from '../../../shared/records/lists'
import type { BarMaterial } from '../../../shared/records/barMaterials'
import type { BlankThreshold } from '../../../shared/barModel/blankThresholds'

/** A workshop is a tenant: every other row hangs off one. */
export const workshops = pgTable('workshops', {
  id: recordId(),
  name: text('name').notNull(),
  address: text('address').notNull().default(''),
  referenceHz: doublePrecision('reference_hz').notNull().default(440),
  temperatureUnit: text('temperature_unit', { enum: TEMPERATURE_UNITS }).notNull().default('C'),
  // Times are shown in this IANA zone and dates written in this BCP 47 locale (checked with Intl on the way in).
  timeZone: text('time_zone').notNull().default('UTC'),
  locale: text('locale').notNull().default('en-GB'),
  /** Days an input calibration stays valid (a workshop setting; 90 unless changed). */
  calibrationValidDays: integer('calibration_valid_days').notNull().default(90),
  /** Ask the benchmaker for three strikes at the final state before review (Type A repeatability). */
  repeatStrikesBeforeReview: boolean('repeat_strikes_before_review').notNull().default(false),
  /** The workshop's own blank-grading thresholds per species; a species not listed uses the starting ones. */
  blankThresholds: jsonb('blank_thresholds').$type<Partial<Record<BarMaterial, BlankThreshold>>>().notNull().default({}),
  createdAt: createdAt(),
})

export const users = pgTable('users', {
  id: recordId(),
  email: text('email').notNull(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  mustChangePassword: boolean('must_change_password').notNull().default(false),
  createdAt: createdAt(),
}, t => [uniqueIndex('users_email_key').on(sql`lower(${t.email})`)])

export const memberships = pgTable('memberships', {
  ...workshopRecord(),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  role: text('role', { enum: ROLES }).notNull(),
  createdAt: createdAt(),
}, t => [
  uniqueIndex('memberships_workshop_user_key').on(t.workshopId, t.userId),
  index('memberships_user_idx').on(t.userId),
])

/** Opaque bearer tokens, stored only as a keyed hash; a row per signed-in device. */
export const sessions = pgTable('sessions', {
  id: recordId(),
  tokenHash: text('token_hash').notNull(),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  workshopId: uuid('workshop_id').references(() => workshops.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  expiresAt: instant('expires_at').notNull(),
}, t => [uniqueIndex('sessions_token_hash_key').on(t.tokenHash), index('sessions_user_idx').on(t.userId)])

/** Failed sign-ins, counted per address and per account for rate limiting. */
export const loginAttempts = pgTable('login_attempts', {
  id: recordId(),
  ip: text('ip').notNull(),
  email: text('email').notNull(),
  at: instant('at').notNull().defaultNow(),
}, t => [index('login_attempts_ip_idx').on(t.ip, t.at), index('login_attempts_email_idx').on(t.email, t.at)])

/** Who did what, when, from which state to which, and why. Append-only. */
export const auditEvents = pgTable('audit_events', {
  ...workshopRecord(),
  actorId: personRef('actor_id'),
  action: text('action').notNull(),
  subjectType: text('subject_type').notNull(),
  subjectId: uuid('subject_id'),
  fromState: text('from_state'),
  toState: text('to_state'),
  reason: text('reason'),
  details: jsonb('details').$type<Record<string, unknown>>(),
  at: instant('at').notNull().defaultNow(),
}, t => [index('audit_events_workshop_idx').on(t.workshopId, t.at), index('audit_events_subject_idx').on(t.subjectId)])

export type Workshop = typeof workshops.$inferSelect
export type User = typeof users.$inferSelect
export type Membership = typeof memberships.$inferSelect
export type Session = typeof sessions.$inferSelect
export type AuditEvent = typeof auditEvents.$inferSelect
