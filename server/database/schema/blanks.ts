/** Graded blanks: raw bars measured before cutting, recorded against their lot, later made into a piece. */
import { doublePrecision, index, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { createdAt, personRef, workshopRecord } from './columns'
import { BLANK_RANKS, type BlankGrade } from '../../../shared/barModel/gradeFromThresholds'
import { BAR_MATERIAL_NAMES } from '../../../shared/records/barMaterials'
import { lots, pieces } from './records'

/** One graded blank: what was entered, what the model made of it, and the piece it became (at most one). */
export const blanks = pgTable('blanks', {
  ...workshopRecord(),
  lotId: uuid('lot_id').references(() => lots.id, { onDelete: 'set null' }),
  species: text('species', { enum: BAR_MATERIAL_NAMES }).notNull(),
  lengthMm: doublePrecision('length_mm').notNull(),
  widthMm: doublePrecision('width_mm').notNull(),
  thicknessMm: doublePrecision('thickness_mm').notNull(),
  massG: doublePrecision('mass_g').notNull(),
  f1Hz: doublePrecision('f1_hz').notNull(),
  decayDbPerS: doublePrecision('decay_db_per_s'),
  densityKgM3: doublePrecision('density_kg_m3').notNull(),
  youngsModulusGPa: doublePrecision('youngs_modulus_gpa').notNull(),
  youngsModulusTimoshenkoGPa: doublePrecision('youngs_modulus_timoshenko_gpa').notNull(),
  specificModulus: doublePrecision('specific_modulus').notNull(),
  lossFactor: doublePrecision('loss_factor'),
  rank: text('rank', { enum: BLANK_RANKS }).notNull(),
  grade: jsonb('grade').$type<BlankGrade>().notNull(),
  pieceId: uuid('piece_id').references(() => pieces.id, { onDelete: 'set null' }),
  createdBy: personRef('created_by'),
  createdAt: createdAt(),
}, t => [
  index('blanks_workshop_species_idx').on(t.workshopId, t.species, t.createdAt),
  uniqueIndex('blanks_piece_key').on(t.pieceId),
])

export type Blank = typeof blanks.$inferSelect
