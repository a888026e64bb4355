import { sql } from 'drizzle-orm'
import {
  boolean, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid,
} from 'drizzle-orm/pg-core'
import type { TemplatePartialSpec } from '../../shared/analysis/types'
import { ROLES } from '../../shared/auth/roles'
import { PIECE_STAGES } from '../../shared/records/stages'
import {
  ANALYSIS_REASONS, CERTIFICATE_PDF_STATUSES, CERTIFICATE_STATUSES, MAIL_KINDS, MAIL_STATUSES, PIECE_VERDICTS,
  REANALYSIS_SCOPES, REANALYSIS_STATUSES, REVIEW_DECISIONS, TEMPERATURE_UNITS, TEMPLATE_FAMILIES,
} from '../../shared/records/lists'
import type { ReanalysisResult } from '../../shared/reanalysis/types'
import type { StoredAnalysis } from '../../shared/schemas/analysis'
import type { StoredCertificateContent } from '../../shared/schemas/certificateContent'

/** A workshop is a tenant: every other row hangs off one. */
export const workshops = pgTable('workshops', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  address: text('address').notNull().default(''),
  referenceHz: doublePrecision('reference_hz').notNull().default(440),
  temperatureUnit: text('temperature_unit', { enum: TEMPERATURE_UNITS }).notNull().default('C'),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
})

export const users = pgTable('users', {
  id: uuid('id').primaryKey().defaultRandom(),
  email: text('email').notNull(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  mustChangePassword: boolean('must_change_password').notNull().default(false),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('users_email_key').on(sql`lower(${t.email})`)])

export const memberships = pgTable('memberships', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  role: text('role', { enum: ROLES }).notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  uniqueIndex('memberships_workshop_user_key').on(t.workshopId, t.userId),
  index('memberships_user_idx').on(t.userId),
])

/** Opaque bearer tokens, stored only as a keyed hash; a row per signed-in device. */
export const sessions = pgTable('sessions', {
  id: uuid('id').primaryKey().defaultRandom(),
  tokenHash: text('token_hash').notNull(),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  workshopId: uuid('workshop_id').references(() => workshops.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
}, t => [uniqueIndex('sessions_token_hash_key').on(t.tokenHash), index('sessions_user_idx').on(t.userId)])

/** Failed sign-ins, counted per address and per account for rate limiting. */
export const loginAttempts = pgTable('login_attempts', {
  id: uuid('id').primaryKey().defaultRandom(),
  ip: text('ip').notNull(),
  email: text('email').notNull(),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('login_attempts_ip_idx').on(t.ip, t.at), index('login_attempts_email_idx').on(t.email, t.at)])

/** Who did what, when, from which state to which, and why. Append-only. */
export const auditEvents = pgTable('audit_events', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
  action: text('action').notNull(),
  subjectType: text('subject_type').notNull(),
  subjectId: uuid('subject_id'),
  fromState: text('from_state'),
  toState: text('to_state'),
  reason: text('reason'),
  details: jsonb('details').$type<Record<string, unknown>>(),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('audit_events_workshop_idx').on(t.workshopId, t.at), index('audit_events_subject_idx').on(t.subjectId)])

export type Workshop = typeof workshops.$inferSelect
export type User = typeof users.$inferSelect
export type Membership = typeof memberships.$inferSelect
export type Session = typeof sessions.$inferSelect
export type AuditEvent = typeof auditEvents.$inferSelect

// ---------------------------------------------------------------- records

/** One partial of a ratio template, as stored in a template version (the engine's own shape). */
export type StoredTemplatePartial = TemplatePartialSpec

/** A ratio template; its content lives in immutable versions. */
export const ratioTemplates = pgTable('ratio_templates', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  family: text('family', { enum: TEMPLATE_FAMILIES }).notNull(),
  name: text('name').notNull(),
  currentVersion: integer('current_version').notNull().default(1),
  archived: boolean('archived').notNull().default(false),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('ratio_templates_workshop_idx').on(t.workshopId)])

/** An immutable version of a template: pieces and verdicts point at one of these. */
export const templateVersions = pgTable('template_versions', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  templateId: uuid('template_id').notNull().references(() => ratioTemplates.id, { onDelete: 'cascade' }),
  version: integer('version').notNull(),
  name: text('name').notNull(),
  family: text('family', { enum: TEMPLATE_FAMILIES }).notNull(),
  partials: jsonb('partials').$type<StoredTemplatePartial[]>().notNull(),
  searchWindowCents: doublePrecision('search_window_cents').notNull().default(80),
  referenceTemperatureC: doublePrecision('reference_temperature_c').notNull().default(20),
  temperatureCoefficientCentsPerC: doublePrecision('temperature_coefficient_cents_per_c').notNull().default(0),
  notes: text('notes').notNull().default(''),
  source: text('source').notNull().default(''),
  createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('template_versions_template_version_key').on(t.templateId, t.version)])

/** A batch of raw material, for traceability. */
export const lots = pgTable('lots', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  code: text('code').notNull(),
  material: text('material').notNull(),
  species: text('species').notNull().default(''),
  supplier: text('supplier').notNull().default(''),
  receivedOn: text('received_on'),
  moisturePct: doublePrecision('moisture_pct'),
  documents: text('documents').notNull().default(''),
  notes: text('notes').notNull().default(''),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('lots_workshop_code_key').on(t.workshopId, t.code)])

/** A register of a set and the template its pieces use. */
export interface SetRegister { fromNote: string, toNote: string, templateId: string }

/** The instrument a buyer ordered. */
export const sets = pgTable('sets', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  model: text('model').notNull(),
  serial: text('serial').notNull(),
  buyerName: text('buyer_name').notNull(),
  buyerOrganisation: text('buyer_organisation').notNull().default(''),
  buyerEmail: text('buyer_email').notNull(),
  referenceHz: doublePrecision('reference_hz').notNull().default(440),
  temperament: text('temperament').notNull().default('equal'),
  noteOffsetsCents: jsonb('note_offsets_cents').$type<Record<string, number>>().notNull().default({}),
  fromNote: text('from_note').notNull(),
  toNote: text('to_note').notNull(),
  chromatic: boolean('chromatic').notNull().default(true),
  templateId: uuid('template_id').references(() => ratioTemplates.id, { onDelete: 'set null' }),
  registers: jsonb('registers').$type<SetRegister[]>().notNull().default([]),
  dueOn: text('due_on'),
  shippedAt: timestamp('shipped_at', { withTimezone: true }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('sets_workshop_idx').on(t.workshopId, t.createdAt), uniqueIndex('sets_workshop_serial_key').on(t.workshopId, t.serial)])

/** One bar, plate, note field, bell or drum. Latest-strike columns are kept for fast lists. */
export const pieces = pgTable('pieces', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  setId: uuid('set_id').notNull().references(() => sets.id, { onDelete: 'cascade' }),
  position: integer('position').notNull(),
  note: text('note').notNull(),
  midi: integer('midi').notNull(),
  targetHz: doublePrecision('target_hz').notNull(),
  templateVersionId: uuid('template_version_id').notNull().references(() => templateVersions.id),
  lotId: uuid('lot_id').references(() => lots.id, { onDelete: 'set null' }),
  stage: text('stage', { enum: PIECE_STAGES }).notNull().default('blank'),
  assigneeId: uuid('assignee_id').references(() => users.id, { onDelete: 'set null' }),
  strikeCount: integer('strike_count').notNull().default(0),
  reworkCount: integer('rework_count').notNull().default(0),
  latestStrikeId: uuid('latest_strike_id'),
  latestVerdict: text('latest_verdict', { enum: PIECE_VERDICTS }),
  latestWorstCents: doublePrecision('latest_worst_cents'),
  latestFundamentalHz: doublePrecision('latest_fundamental_hz'),
  latestStrikeAt: timestamp('latest_strike_at', { withTimezone: true }),
  approvedStrikeId: uuid('approved_strike_id'),
  approvedAt: timestamp('approved_at', { withTimezone: true }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  uniqueIndex('pieces_set_position_key').on(t.setId, t.position),
  index('pieces_workshop_set_idx').on(t.workshopId, t.setId, t.position),
  index('pieces_workshop_stage_idx').on(t.workshopId, t.stage, t.updatedAt),
  index('pieces_workshop_verdict_idx').on(t.workshopId, t.latestVerdict),
  index('pieces_workshop_assignee_idx').on(t.workshopId, t.assigneeId),
  // The Pieces list sorted by worst cents (its default for review) reads this in order and stops at the page.
  index('pieces_workshop_cents_idx').on(t.workshopId, sql`abs(${t.latestWorstCents}) desc nulls last`, t.id),
])

/**
 * One recording of one blow on one piece, with the engine's current result. The audio and
 * conditions never change; a re-measurement with a newer engine moves the result columns
 * (engine_version, analysis, fundamental_hz, worst_cents, verdict) to the newest result,
 * and every result, old and new, stays in `strike_analyses`.
 */
export const strikes = pgTable('strikes', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  pieceId: uuid('piece_id').notNull().references(() => pieces.id, { onDelete: 'cascade' }),
  userId: uuid('user_id').references(() => users.id, { onDelete: 'set null' }),
  stage: text('stage', { enum: PIECE_STAGES }).notNull(),
  temperatureC: doublePrecision('temperature_c'),
  humidityPct: doublePrecision('humidity_pct'),
  audioKey: text('audio_key').notNull(),
  audioBytes: integer('audio_bytes').notNull(),
  audioType: text('audio_type').notNull(),
  audioName: text('audio_name').notNull().default(''),
  engineVersion: text('engine_version').notNull(),
  analysis: jsonb('analysis').$type<StoredAnalysis>().notNull(),
  templateVersionId: uuid('template_version_id').references(() => templateVersions.id),
  fundamentalHz: doublePrecision('fundamental_hz'),
  worstCents: doublePrecision('worst_cents'),
  verdict: text('verdict', { enum: PIECE_VERDICTS }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  index('strikes_piece_idx').on(t.pieceId, t.createdAt),
  index('strikes_workshop_user_idx').on(t.workshopId, t.userId, t.createdAt),
])

/**
 * A request to re-measure the stored strikes of a piece or a set with the current
 * engine, run as a background job. At most one run per set is queued or running.
 */
export const reanalysisRuns = pgTable('reanalysis_runs', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  setId: uuid('set_id').notNull().references(() => sets.id, { onDelete: 'cascade' }),
  pieceId: uuid('piece_id').references(() => pieces.id, { onDelete: 'cascade' }),
  scope: text('scope', { enum: REANALYSIS_SCOPES }).notNull(),
  status: text('status', { enum: REANALYSIS_STATUSES }).notNull().default('queued'),
  reason: text('reason').notNull().default(''),
  /** The engine version that measured the run (set when it finishes). */
  engineVersion: text('engine_version'),
  jobId: text('job_id'),
  result: jsonb('result').$type<ReanalysisResult>(),
  error: text('error'),
  requestedBy: uuid('requested_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  startedAt: timestamp('started_at', { withTimezone: true }),
  finishedAt: timestamp('finished_at', { withTimezone: true }),
}, t => [
  uniqueIndex('reanalysis_runs_active_set_key').on(t.setId).where(sql`status in ('queued', 'running')`),
  index('reanalysis_runs_workshop_idx').on(t.workshopId, t.createdAt),
  index('reanalysis_runs_status_idx').on(t.status, t.jobId),
])

/**
 * Every result a strike has had, oldest first: the first measurement ('recorded') and
 * each re-measurement ('reanalyze'). `applied` says whether the result became the
 * strike's current one (a signed piece's strikes keep the result they were signed on).
 */
export const strikeAnalyses = pgTable('strike_analyses', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  strikeId: uuid('strike_id').notNull().references(() => strikes.id, { onDelete: 'cascade' }),
  engineVersion: text('engine_version').notNull(),
  analysis: jsonb('analysis').$type<StoredAnalysis>().notNull(),
  verdict: text('verdict', { enum: PIECE_VERDICTS }),
  worstCents: doublePrecision('worst_cents'),
  fundamentalHz: doublePrecision('fundamental_hz'),
  applied: boolean('applied').notNull().default(true),
  reason: text('reason', { enum: ANALYSIS_REASONS }).notNull(),
  runId: uuid('run_id').references(() => reanalysisRuns.id, { onDelete: 'set null' }),
  createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  index('strike_analyses_strike_idx').on(t.strikeId, t.createdAt),
  index('strike_analyses_workshop_idx').on(t.workshopId, t.createdAt),
])

/** A supervisor's decision on a piece: approve, return for rework, or reopen an approval. */
export const reviews = pgTable('reviews', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  pieceId: uuid('piece_id').notNull().references(() => pieces.id, { onDelete: 'cascade' }),
  strikeId: uuid('strike_id').references(() => strikes.id),
  supervisorId: uuid('supervisor_id').references(() => users.id, { onDelete: 'set null' }),
  decision: text('decision', { enum: REVIEW_DECISIONS }).notNull(),
  comment: text('comment').notNull().default(''),
  overrideReason: text('override_reason'),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('reviews_piece_idx').on(t.pieceId, t.createdAt)])

export type RatioTemplate = typeof ratioTemplates.$inferSelect
export type TemplateVersion = typeof templateVersions.$inferSelect
export type Lot = typeof lots.$inferSelect
export type InstrumentSet = typeof sets.$inferSelect
export type Piece = typeof pieces.$inferSelect
export type Strike = typeof strikes.$inferSelect
export type Review = typeof reviews.$inferSelect
export type ReanalysisRun = typeof reanalysisRuns.$inferSelect
export type StrikeAnalysis = typeof strikeAnalyses.$inferSelect

// ---------------------------------------------------------------- certificates and mail

/**
 * A signed tuning certificate. `content` is frozen at signing; `contentHash` is the
 * SHA-256 of its canonical JSON, so a later change to either is detectable.
 */
export const certificates = pgTable('certificates', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  setId: uuid('set_id').notNull().references(() => sets.id, { onDelete: 'cascade' }),
  number: text('number').notNull(),
  code: text('code').notNull(),
  status: text('status', { enum: CERTIFICATE_STATUSES }).notNull().default('valid'),
  content: jsonb('content').$type<StoredCertificateContent>().notNull(),
  contentHash: text('content_hash').notNull(),
  pdfKey: text('pdf_key').notNull(),
  // The PDF is rendered by a job after the signing transaction commits, and again when
  // the status changes (with a REVOKED or SUPERSEDED mark): `pending` until it is stored.
  pdfStatus: text('pdf_status', { enum: CERTIFICATE_PDF_STATUSES }).notNull().default('ready'),
  pdfJobId: text('pdf_job_id'),
  pdfRequestedAt: timestamp('pdf_requested_at', { withTimezone: true }),
  reissueReason: text('reissue_reason'),
  signerId: uuid('signer_id').references(() => users.id, { onDelete: 'set null' }),
  signerName: text('signer_name').notNull(),
  signedAt: timestamp('signed_at', { withTimezone: true }).notNull(),
  supersedesId: uuid('supersedes_id'),
  supersededById: uuid('superseded_by_id'),
  revokedReason: text('revoked_reason'),
  revokedAt: timestamp('revoked_at', { withTimezone: true }),
  revokedBy: uuid('revoked_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  uniqueIndex('certificates_code_key').on(t.code),
  uniqueIndex('certificates_workshop_number_key').on(t.workshopId, t.number),
  index('certificates_workshop_idx').on(t.workshopId, t.signedAt),
  index('certificates_set_idx').on(t.setId),
  // At most one valid certificate per set: a second signing races into this and answers 409.
  uniqueIndex('certificates_set_valid_key').on(t.setId).where(sql`${t.status} = 'valid'`),
  index('certificates_pdf_pending_idx').on(t.pdfStatus, t.pdfJobId),
])

/**
 * The outbox: every e-mail is a row first; a background job delivers it. Password
 * resets belong to no workshop, so `workshop_id` may be null for them alone.
 */
export const mailMessages = pgTable('mail_messages', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').references(() => workshops.id, { onDelete: 'cascade' }),
  kind: text('kind', { enum: MAIL_KINDS }).notNull(),
  to: text('to').notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  html: text('html').notNull(),
  status: text('status', { enum: MAIL_STATUSES }).notNull().default('queued'),
  attempts: integer('attempts').notNull().default(0),
  lastError: text('last_error'),
  jobId: text('job_id'),
  // The delivery lease: a worker claims a message until `claimed_until`; a claim of a
  // worker that died expires and the message is delivered by another one.
  claimedBy: text('claimed_by'),
  claimedUntil: timestamp('claimed_until', { withTimezone: true }),
  certificateId: uuid('certificate_id').references(() => certificates.id, { onDelete: 'set null' }),
  setId: uuid('set_id').references(() => sets.id, { onDelete: 'set null' }),
  requestedBy: uuid('requested_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  sentAt: timestamp('sent_at', { withTimezone: true }),
}, t => [
  index('mail_messages_workshop_idx').on(t.workshopId, t.createdAt),
  index('mail_messages_set_idx').on(t.setId, t.createdAt),
  index('mail_messages_status_idx').on(t.status, t.jobId),
])

/** An invitation to join a workshop; the token is stored only as a keyed hash. */
export const invitations = pgTable('invitations', {
  id: uuid('id').primaryKey().defaultRandom(),
  workshopId: uuid('workshop_id').notNull().references(() => workshops.id, { onDelete: 'cascade' }),
  email: text('email').notNull(),
  name: text('name').notNull().default(''),
  role: text('role', { enum: ROLES }).notNull(),
  tokenHash: text('token_hash').notNull(),
  invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  usedAt: timestamp('used_at', { withTimezone: true }),
  // Revoked from the Team screen, replaced by a newer invitation, or because the inviter lost the right to invite.
  revokedAt: timestamp('revoked_at', { withTimezone: true }),
  revokedBy: uuid('revoked_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  uniqueIndex('invitations_token_hash_key').on(t.tokenHash),
  index('invitations_workshop_idx').on(t.workshopId),
  index('invitations_inviter_idx').on(t.workshopId, t.invitedBy),
])

/** A single-use password reset link; accounts span workshops, so no workshop here. */
export const passwordResets = pgTable('password_resets', {
  id: uuid('id').primaryKey().defaultRandom(),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  usedAt: timestamp('used_at', { withTimezone: true }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('password_resets_token_hash_key').on(t.tokenHash), index('password_resets_user_idx').on(t.userId)])

export type Certificate = typeof certificates.$inferSelect
export type MailMessage = typeof mailMessages.$inferSelect
export type Invitation = typeof invitations.$inferSelect
export type PasswordReset = typeof passwordResets.$inferSelect
