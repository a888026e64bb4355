/** Records: ratio templates and their versions, lots, sets and pieces. */
import { sql } from 'drizzle-orm'
import { boolean, doublePrecision, index, integer, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { createdAt, instant, personRef, workshopRecord } from './columns'
import type { TemplatePartialSpec } from '../../../shared/analysis/types'
import { PIECE_STAGES } from '../../../shared/records/stages'
import { PIECE_VERDICTS, TEMPLATE_FAMILIES } from '../../../shared/records/lists'
import { DECISION_RULES } from '../../../shared/uncertainty/types'
import { BAR_MATERIAL_NAMES } from '../../../shared/records/barMaterials'
import type { PieceGeometry } from '../../../shared/schemas/pieceGeometry'

/** One partial of a ratio template, as stored in a template version (the engine's own shape). */
export type StoredTemplatePartial = TemplatePartialSpec

/** A ratio template; its content lives in immutable versions. */
export const ratioTemplates = pgTable('ratio_templates', {
  ...workshopRecord(),
  family: text('family', { enum: TEMPLATE_FAMILIES }).notNull(),
  name: text('name').notNull(),
  currentVersion: integer('current_version').notNull().default(1),
  archived: boolean('archived').notNull().default(false),
  createdAt: createdAt(),
}, t => [index('ratio_templates_workshop_idx').on(t.workshopId)])

/** An immutable version of a template: pieces and verdicts point at one of these. */
export const templateVersions = pgTable('template_versions', {
  ...workshopRecord(),
  templateId: uuid('template_id').notNull().references(() => ratioTemplates.id, { onDelete: 'cascade' }),
  version: integer('version').notNull(),
  name: text('name').notNull(),
  family: text('family', { enum: TEMPLATE_FAMILIES }).notNull(),
  partials: jsonb('partials').$type<StoredTemplatePartial[]>().notNull(),
  searchWindowCents: doublePrecision('search_window_cents').notNull().default(80),
  referenceTemperatureC: doublePrecision('reference_temperature_c').notNull().default(20),
  temperatureCoefficientCentsPerC: doublePrecision('temperature_coefficient_cents_per_c').notNull().default(0),
  /** How a partial's verdict uses the expanded uncertainty U (ILAC-G8): simple or guarded acceptance. */
  decisionRule: text('decision_rule', { enum: DECISION_RULES }).notNull().default('simple'),
  notes: text('notes').notNull().default(''),
  source: text('source').notNull().default(''),
  createdBy: personRef('created_by'),
  createdAt: createdAt(),
}, t => [uniqueIndex('template_versions_template_version_key').on(t.templateId, t.version)])

/** A batch of raw material, for traceability. */
export const lots = pgTable('lots', {
  ...workshopRecord(),
  code: text('code').notNull(),
  material: text('material').notNull(),
  species: text('species').notNull().default(''),
  supplier: text('supplier').notNull().default(''),
  receivedOn: text('received_on'),
  moisturePct: doublePrecision('moisture_pct'),
  // The permit or certificate number a listed timber species needs (shared/records/listedTimber.ts).
  permitNumber: text('permit_number').notNull().default(''),
  documents: text('documents').notNull().default(''),
  notes: text('notes').notNull().default(''),
  createdAt: createdAt(),
}, t => [uniqueIndex('lots_workshop_code_key').on(t.workshopId, t.code)])

/** A register of a set and the template its pieces use. */
export interface SetRegister { fromNote: string, toNote: string, templateId: string }

/** The instrument a buyer ordered. */
export const sets = pgTable('sets', {
  ...workshopRecord(),
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
  /** The office's notes about the order (free text, editable). */
  notes: text('notes').notNull().default(''),
  shippedAt: instant('shipped_at'),
  createdAt: createdAt(),
}, t => [index('sets_workshop_idx').on(t.workshopId, t.createdAt), uniqueIndex('sets_workshop_serial_key').on(t.workshopId, t.serial)])

/** One bar, plate, note field, bell or drum. Latest-strike columns are kept for fast lists. */
export const pieces = pgTable('pieces', {
  ...workshopRecord(),
  setId: uuid('set_id').notNull().references(() => sets.id, { onDelete: 'cascade' }),
  position: integer('position').notNull(),
  note: text('note').notNull(),
  midi: integer('midi').notNull(),
  targetHz: doublePrecision('target_hz').notNull(),
  templateVersionId: uuid('template_version_id').notNull().references(() => templateVersions.id),
  lotId: uuid('lot_id').references(() => lots.id, { onDelete: 'set null' }),
  stage: text('stage', { enum: PIECE_STAGES }).notNull().default('blank'),
  assigneeId: personRef('assignee_id'),
  strikeCount: integer('strike_count').notNull().default(0),
  reworkCount: integer('rework_count').notNull().default(0),
  latestStrikeId: uuid('latest_strike_id'),
  latestVerdict: text('latest_verdict', { enum: PIECE_VERDICTS }),
  latestWorstCents: doublePrecision('latest_worst_cents'),
  latestFundamentalHz: doublePrecision('latest_fundamental_hz'),
  latestStrikeAt: instant('latest_strike_at'),
  approvedStrikeId: uuid('approved_strike_id'),
  approvedAt: instant('approved_at'),
  // An approval can be undone until this time (the database's clock); null or past: final.
  approvalFinalAt: instant('approval_final_at'),
  /** The bar model's geometry entered by hand; null: the register's default for the note. */
  geometry: jsonb('geometry').$type<PieceGeometry>(),
  material: text('material', { enum: BAR_MATERIAL_NAMES }),
  createdAt: createdAt(),
  updatedAt: instant('updated_at').notNull().defaultNow(),
}, t => [
  uniqueIndex('pieces_set_position_key').on(t.setId, t.position),
  index('pieces_workshop_set_idx').on(t.workshopId, t.setId, t.position),
  index('pieces_workshop_stage_idx').on(t.workshopId, t.stage, t.updatedAt),
  index('pieces_workshop_verdict_idx').on(t.workshopId, t.latestVerdict),
  index('pieces_workshop_assignee_idx').on(t.workshopId, t.assigneeId),
  // The Pieces list sorted by worst cents (its default for review) reads this in order and stops at the page.
  index('pieces_workshop_cents_idx').on(t.workshopId, sql`abs(${t.latestWorstCents}) desc nulls last`, t.id),
])

export type RatioTemplate = typeof ratioTemplates.$inferSelect
export type TemplateVersion = typeof templateVersions.$inferSelect
export type Lot = typeof lots.$inferSelect
export type InstrumentSet = typeof sets.$inferSelect
export type Piece = typeof pieces.$inferSelect
