/** Saved cut plans: where to cut a bar and how deep, from one strike and one geometry. */
import { boolean, doublePrecision, index, integer, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { createdAt, personRef, workshopRecord } from './columns'
import { BAR_MATERIAL_NAMES } from '../../../shared/records/barMaterials'
import { TEMPLATE_FAMILIES } from '../../../shared/records/lists'
import type { CutPlan } from '../../../shared/schemas/cutPlan'
import type { PieceGeometry } from '../../../shared/schemas/pieceGeometry'
import { pieces } from './records'
import { strikes } from './strikes'

/** One partial's prediction as saved: the planner's figures and the tolerance it aimed at. */
export type SavedPrediction = CutPlan['predicted'][number] & { toleranceCents: number }

/**
 * A plan saved with the strike it came from (one per strike), the geometry and material it
 * used, the hand factor applied and the model's own change of the fundamental (before that
 * factor), from which later plans learn the workshop's hand.
 */
export const cutPlans = pgTable('cut_plans', {
  ...workshopRecord(),
  pieceId: uuid('piece_id').notNull().references(() => pieces.id, { onDelete: 'cascade' }),
  strikeId: uuid('strike_id').notNull().references(() => strikes.id, { onDelete: 'cascade' }),
  family: text('family', { enum: TEMPLATE_FAMILIES }).notNull(),
  material: text('material', { enum: BAR_MATERIAL_NAMES }).notNull(),
  geometry: jsonb('geometry').$type<PieceGeometry>().notNull(),
  modesHz: jsonb('modes_hz').$type<CutPlan['modesHz']>().notNull(),
  stations: jsonb('stations').$type<CutPlan['stations']>().notNull(),
  predicted: jsonb('predicted').$type<SavedPrediction[]>().notNull(),
  feasible: boolean('feasible').notNull(),
  note: text('note'),
  handFactor: doublePrecision('hand_factor').notNull(),
  handFactorPlans: integer('hand_factor_plans').notNull(),
  modelFundamentalChangeCents: doublePrecision('model_fundamental_change_cents').notNull(),
  modelVersion: text('model_version').notNull(),
  engineVersion: text('engine_version').notNull(),
  createdBy: personRef('created_by'),
  createdAt: createdAt(),
}, t => [
  uniqueIndex('cut_plans_strike_key').on(t.strikeId),
  index('cut_plans_piece_idx').on(t.pieceId, t.createdAt),
  index('cut_plans_hand_idx').on(t.workshopId, t.family, t.material, t.createdAt),
])

export type SavedCutPlan = typeof cutPlans.$inferSelect
