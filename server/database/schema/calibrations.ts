/** Calibrations of a workshop's sound inputs: a recorded reference tone and the clock offset it showed. */
import { doublePrecision, index, pgTable, text } from 'drizzle-orm/pg-core'
import { createdAt, personRef, workshopRecord } from './columns'

/**
 * One calibration of one input device; a device's newest row is its current calibration,
 * the older ones its history (drift over time). Never edited: a new tone makes a new row.
 */
export const calibrations = pgTable('calibrations', {
  ...workshopRecord(),
  device: text('device').notNull(),
  referenceHz: doublePrecision('reference_hz').notNull(),
  /** The reference's stated standard uncertainty, ppm (0 when not given). */
  referenceUncertaintyPpm: doublePrecision('reference_uncertainty_ppm').notNull().default(0),
  /** The workshop's words for its reference (what the tone came from and what it is locked to). */
  referenceDescription: text('reference_description').notNull().default(''),
  measuredHz: doublePrecision('measured_hz').notNull(),
  /** Positive: the input reads high. */
  offsetPpm: doublePrecision('offset_ppm').notNull(),
  /** Standard uncertainty (k = 1) of the offset, ppm. */
  uncertaintyPpm: doublePrecision('uncertainty_ppm').notNull(),
  operatorId: personRef('operator_id'),
  createdAt: createdAt(),
}, t => [
  index('calibrations_device_idx').on(t.workshopId, t.device, t.createdAt),
])

export type Calibration = typeof calibrations.$inferSelect
