/**
 * The value lists of the records, each declared once: the database columns, the zod
 * schemas, the screens and the services import them from here. Roles live in
 * shared/auth/roles.ts and piece stages in shared/records/stages.ts, beside their rules.
 * The order of each tuple is the order shown on screens.
 */

/** True when `value` is one of the list's values. */
export function isOneOf<T extends string>(list: readonly T[], value: unknown): value is T {
  return typeof value === 'string' && (list as readonly string[]).includes(value)
}

/**
 * The values of a label table, in its order: for a list shown with labels, each value is
 * written once, as a key beside its label.
 */
export function keysOf<K extends string>(labels: Record<K, string>): readonly [K, ...K[]] {
  return Object.keys(labels) as [K, ...K[]]
}

/** A piece's verdict over its required partials. */
export const PIECE_VERDICTS = ['within', 'outside', 'incomplete'] as const
export type PieceVerdict = (typeof PIECE_VERDICTS)[number]

/** How one partial is shown: within its band, sharp or flat outside it, or missing. */
export const PARTIAL_STATES = ['within', 'sharp', 'flat', 'missing'] as const
export type PartialState = (typeof PARTIAL_STATES)[number]

/** The direction of a matched partial's deviation (null when it was not found). */
export const PARTIAL_DIRECTIONS = ['sharp', 'flat', 'on'] as const
export type PartialDirection = (typeof PARTIAL_DIRECTIONS)[number]

/** Kinds of piece a ratio template is made for. */
export const TEMPLATE_FAMILIES = ['bar', 'plate', 'tube', 'note field', 'bell', 'membrane', 'tine'] as const
export type TemplateFamily = (typeof TEMPLATE_FAMILIES)[number]

/** The unit a workshop reads temperatures in. */
export const TEMPERATURE_UNITS = ['C', 'F'] as const
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number]

/** A supervisor's decision on a piece. */
export const REVIEW_DECISIONS = ['approve', 'return', 'reopen'] as const
export type ReviewDecision = (typeof REVIEW_DECISIONS)[number]

/** Why an analysis of a strike was stored: when it was recorded, or by a re-measurement. */
export const ANALYSIS_REASONS = ['recorded', 'reanalyze'] as const
export type AnalysisReason = (typeof ANALYSIS_REASONS)[number]

/** What a re-measurement run covers. */
export const REANALYSIS_SCOPES = ['piece', 'set'] as const
export type ReanalysisScope = (typeof REANALYSIS_SCOPES)[number]

/** Where a re-measurement run stands. */
export const REANALYSIS_STATUSES = ['queued', 'running', 'done', 'failed'] as const
export type ReanalysisStatus = (typeof REANALYSIS_STATUSES)[number]

/** A certificate's standing: a newer one supersedes it, or it is revoked. */
export const CERTIFICATE_STATUSES = ['valid', 'superseded', 'revoked'] as const
export type CertificateStatus = (typeof CERTIFICATE_STATUSES)[number]

/** Whether a certificate's PDF has been rendered and stored yet. */
export const CERTIFICATE_PDF_STATUSES = ['pending', 'ready'] as const
export type CertificatePdfStatus = (typeof CERTIFICATE_PDF_STATUSES)[number]

/** Paper sizes a certificate PDF is rendered on. */
export const PAPER_SIZES = ['a4', 'letter'] as const
export type PaperSize = (typeof PAPER_SIZES)[number]

/** What an e-mail in the outbox is about. */
export const MAIL_KINDS = ['certificate', 'invitation', 'password-reset'] as const
export type MailKind = (typeof MAIL_KINDS)[number]

/** Where an e-mail in the outbox stands. */
export const MAIL_STATUSES = ['queued', 'sent', 'failed'] as const
export type MailStatus = (typeof MAIL_STATUSES)[number]

/** Why a shipped set came back: retuning, or a repair (which is then retuned). */
export const SERVICE_KIND_LABELS = { retune: 'Retune', repair: 'Repair' }
export const SERVICE_KINDS = keysOf(SERVICE_KIND_LABELS)
export type ServiceKind = (typeof SERVICE_KINDS)[number]

/** The moments of a set's life its page lists, in the words it uses. */
export const SET_HISTORY_LABELS = {
  made: 'Made',
  certified: 'Certified',
  shipped: 'Shipped',
  serviced: 'Booked in for service',
  recertified: 'Re-certified',
  revoked: 'Certificate revoked',
}
export const SET_HISTORY_KINDS = keysOf(SET_HISTORY_LABELS)
export type SetHistoryKind = (typeof SET_HISTORY_KINDS)[number]
