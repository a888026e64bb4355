/** Certificates, the mail outbox, invitations and password resets. */
import { sql } from 'drizzle-orm'
import { index, integer, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { createdAt, instant, personRef, recordId, workshopRecord } from './columns'
import { ROLES } from '../../../shared/auth/roles'
import type { StoredCertificateContent } from '../../../shared/schemas/certificateContent'
import { CERTIFICATE_PDF_STATUSES, CERTIFICATE_STATUSES, MAIL_KINDS, MAIL_STATUSES } from '../../../shared/records/lists'
import { users, workshops } from './accounts'
import { sets } from './records'

/**
 * A signed tuning certificate. `content` is frozen at signing; `contentHash` is the
 * SHA-256 of its canonical JSON, so a later change to either is detectable.
 */
export const certificates = pgTable('certificates', {
  ...workshopRecord(),
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
  pdfRequestedAt: instant('pdf_requested_at'),
  reissueReason: text('reissue_reason'),
  signerId: personRef('signer_id'),
  signerName: text('signer_name').notNull(),
  signedAt: instant('signed_at').notNull(),
  supersedesId: uuid('supersedes_id'),
  supersededById: uuid('superseded_by_id'),
  revokedReason: text('revoked_reason'),
  revokedAt: instant('revoked_at'),
  revokedBy: personRef('revoked_by'),
  createdAt: createdAt(),
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
  id: recordId(),
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
  claimedUntil: instant('claimed_until'),
  certificateId: uuid('certificate_id').references(() => certificates.id, { onDelete: 'set null' }),
  setId: uuid('set_id').references(() => sets.id, { onDelete: 'set null' }),
  requestedBy: personRef('requested_by'),
  createdAt: createdAt(),
  updatedAt: instant('updated_at').notNull().defaultNow(),
  sentAt: instant('sent_at'),
}, t => [
  index('mail_messages_workshop_idx').on(t.workshopId, t.createdAt),
  index('mail_messages_set_idx').on(t.setId, t.createdAt),
  index('mail_messages_status_idx').on(t.status, t.jobId),
])

/** An invitation to join a workshop; the token is stored only as a keyed hash. */
export const invitations = pgTable('invitations', {
  ...workshopRecord(),
  email: text('email').notNull(),
  name: text('name').notNull().default(''),
  role: text('role', { enum: ROLES }).notNull(),
  tokenHash: text('token_hash').notNull(),
  invitedBy: personRef('invited_by'),
  expiresAt: instant('expires_at').notNull(),
  usedAt: instant('used_at'),
  // Revoked from the Team screen, replaced by a newer invitation, or because the inviter lost the right to invite.
  revokedAt: instant('revoked_at'),
  revokedBy: personRef('revoked_by'),
  createdAt: createdAt(),
}, t => [
  uniqueIndex('invitations_token_hash_key').on(t.tokenHash),
  index('invitations_workshop_idx').on(t.workshopId),
  index('invitations_inviter_idx').on(t.workshopId, t.invitedBy),
])

/** A single-use password reset link; accounts span workshops, so no workshop here. */
export const passwordResets = pgTable('password_resets', {
  id: recordId(),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull(),
  expiresAt: instant('expires_at').notNull(),
  usedAt: instant('used_at'),
  createdAt: createdAt(),
}, t => [uniqueIndex('password_resets_token_hash_key').on(t.tokenHash), index('password_resets_user_idx').on(t.userId)])

export type Certificate = typeof certificates.$inferSelect
export type MailMessage = typeof mailMessages.$inferSelect
export type Invitation = typeof invitations.$inferSelect
export type PasswordReset = typeof passwordResets.$inferSelect
