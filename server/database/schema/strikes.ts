/** Strikes, their result history, re-measurement runs and reviews. */
import { sql } from 'drizzle-orm'
import { boolean, doublePrecision, index, integer, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { createdAt, instant, personRef, workshopRecord } from './columns'
import { PIECE_STAGES } from '../../../shared/records/stages'
import type { ReanalysisResult } from '../../../shared/reanalysis/types'
import type { StoredAnalysis } from '../../../shared/schemas/analysis'
import { ANALYSIS_REASONS, PIECE_VERDICTS, REANALYSIS_SCOPES, REANALYSIS_STATUSES, REVIEW_DECISIONS } from '../../../shared/records/lists'
import { pieces, sets, templateVersions } from './records'
import { calibrations } from './calibrations'

/**
 * One recording of one blow on one piece, with the engine's current result. The audio and
 * conditions never change; a re-measurement with a newer engine moves the result columns
 * (engine_version, analysis, fundamental_hz, worst_cents, verdict) to the newest result,
 * and every result, old and new, stays in `strike_analyses`.
 */
export const strikes = pgTable('strikes', {
  ...workshopRecord(),
  pieceId: uuid('piece_id').notNull().references(() => pieces.id, { onDelete: 'cascade' }),
  userId: personRef('user_id'),
  stage: text('stage', { enum: PIECE_STAGES }).notNull(),
  temperatureC: doublePrecision('temperature_c'),
  humidityPct: doublePrecision('humidity_pct'),
  audioKey: text('audio_key').notNull(),
  audioBytes: integer('audio_bytes').notNull(),
  audioType: text('audio_type').notNull(),
  audioName: text('audio_name').notNull().default(''),
  /** The input calibration the strike was measured under (its frequencies are corrected by it; the raw ones stay in the analysis). */
  calibrationId: uuid('calibration_id').references(() => calibrations.id),
  engineVersion: text('engine_version').notNull(),
  analysis: jsonb('analysis').$type<StoredAnalysis>().notNull(),
  templateVersionId: uuid('template_version_id').references(() => templateVersions.id),
  fundamentalHz: doublePrecision('fundamental_hz'),
  worstCents: doublePrecision('worst_cents'),
  verdict: text('verdict', { enum: PIECE_VERDICTS }),
  createdAt: createdAt(),
}, t => [
  index('strikes_piece_idx').on(t.pieceId, t.createdAt),
  index('strikes_workshop_user_idx').on(t.workshopId, t.userId, t.createdAt),
])

/**
 * A request to re-measure the stored strikes of a piece or a set with the current
 * engine, run as a background job. At most one run per set is queued or running.
 */
export const reanalysisRuns = pgTable('reanalysis_runs', {
  ...workshopRecord(),
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
  requestedBy: personRef('requested_by'),
  createdAt: createdAt(),
  startedAt: instant('started_at'),
  finishedAt: instant('finished_at'),
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
  ...workshopRecord(),
  strikeId: uuid('strike_id').notNull().references(() => strikes.id, { onDelete: 'cascade' }),
  engineVersion: text('engine_version').notNull(),
  analysis: jsonb('analysis').$type<StoredAnalysis>().notNull(),
  verdict: text('verdict', { enum: PIECE_VERDICTS }),
  worstCents: doublePrecision('worst_cents'),
  fundamentalHz: doublePrecision('fundamental_hz'),
  applied: boolean('applied').notNull().default(true),
  reason: text('reason', { enum: ANALYSIS_REASONS }).notNull(),
  runId: uuid('run_id').references(() => reanalysisRuns.id, { onDelete: 'set null' }),
  createdBy: personRef('created_by'),
  createdAt: createdAt(),
}, t => [
  index('strike_analyses_strike_idx').on(t.strikeId, t.createdAt),
  index('strike_analyses_workshop_idx').on(t.workshopId, t.createdAt),
])

/** A supervisor's decision on a piece: approve, return for rework, or reopen an approval. */
export const reviews = pgTable('reviews', {
  ...workshopRecord(),
  pieceId: uuid('piece_id').notNull().references(() => pieces.id, { onDelete: 'cascade' }),
  strikeId: uuid('strike_id').references(() => strikes.id),
  supervisorId: personRef('supervisor_id'),
  decision: text('decision', { enum: REVIEW_DECISIONS }).notNull(),
  comment: text('comment').notNull().default(''),
  overrideReason: text('override_reason'),
  createdAt: createdAt(),
}, t => [index('reviews_piece_idx').on(t.pieceId, t.createdAt)])

export type Strike = typeof strikes.$inferSelect
export type Review = typeof reviews.$inferSelect
export type ReanalysisRun = typeof reanalysisRuns.$inferSelect
export type StrikeAnalysis = typeof strikeAnalyses.$inferSelect
