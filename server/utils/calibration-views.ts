import { and, desc, eq } from 'drizzle-orm'
import { calibrations, users, workshops, type Calibration } from '../database/schema'
import type { Executor } from '../database/client'
import { calibrationExpiry } from '../../shared/calibration/calibrationExpiry'
import { CalibrationChoiceSchema, type AppliedCalibration, type CalibrationList, type CalibrationView } from '../../shared/schemas/calibrations'
import { fail, validateInput } from './http-errors'

/** Devices' histories are listed whole up to this many rows (years of monthly tones for dozens of inputs). */
const LIST_LIMIT = 2000

const VIEW_COLUMNS = {
  id: calibrations.id, device: calibrations.device, referenceHz: calibrations.referenceHz,
  referenceUncertaintyPpm: calibrations.referenceUncertaintyPpm, referenceDescription: calibrations.referenceDescription, measuredHz: calibrations.measuredHz,
  offsetPpm: calibrations.offsetPpm, uncertaintyPpm: calibrations.uncertaintyPpm, createdAt: calibrations.createdAt,
  operatorName: users.name, validDays: workshops.calibrationValidDays,
}

type ViewRow = Pick<Calibration, 'id' | 'device' | 'referenceHz' | 'referenceUncertaintyPpm' | 'referenceDescription' | 'measuredHz' | 'offsetPpm' | 'uncertaintyPpm' | 'createdAt'>
  & { operatorName: string | null, validDays: number }

function viewOf({ createdAt, validDays, ...row }: ViewRow, now: Date): CalibrationView {
  const expiry = calibrationExpiry(createdAt, validDays, now)
  return { ...row, measuredAt: createdAt.toISOString(), expiresAt: expiry.expiresAt.toISOString(), expired: expiry.expired, daysLeft: expiry.daysLeft }
}

function selectViews(db: Executor) {
  return db.select(VIEW_COLUMNS).from(calibrations)
    .innerJoin(workshops, eq(workshops.id, calibrations.workshopId))
    .leftJoin(users, eq(users.id, calibrations.operatorId))
}

/** What a strike answer says about the calibration it was measured under. */
export function appliedCalibration(view: CalibrationView): AppliedCalibration {
  return { id: view.id, offsetPpm: view.offsetPpm, uncertaintyPpm: view.uncertaintyPpm, device: view.device, measuredAt: view.measuredAt, expiresAt: view.expiresAt }
}

/**
 * The calibration a strike upload names in its `calibration-id` field, or null when it names
 * none: 400 for a malformed id, 404 for one that is not this workshop's (asked before any
 * measuring). An expired calibration still applies; the answer says it has expired.
 */
export async function calibrationInUse(db: Executor, workshopId: string, fields: Record<string, string>, now = new Date()): Promise<CalibrationView | null> {
  const { 'calibration-id': id } = validateInput(CalibrationChoiceSchema, fields)
  if (id === undefined) return null
  const [row] = await selectViews(db).where(and(eq(calibrations.id, id), eq(calibrations.workshopId, workshopId)))
  if (!row) fail(404, 'No such calibration in this workshop.')
  return viewOf(row, now)
}

/** Every device's calibrations, newest first: the first of each is its current calibration, the rest its drift history. */
export async function listCalibrations(db: Executor, workshopId: string, now = new Date()): Promise<CalibrationList> {
  const [workshop] = await db.select({ validDays: workshops.calibrationValidDays }).from(workshops).where(eq(workshops.id, workshopId))
  if (!workshop) fail(404, 'No such workshop.')
  const rows = await selectViews(db).where(eq(calibrations.workshopId, workshopId))
    .orderBy(calibrations.device, desc(calibrations.createdAt), desc(calibrations.id)).limit(LIST_LIMIT)
  const byDevice = new Map<string, CalibrationView[]>()
  for (const row of rows) byDevice.set(row.device, [...(byDevice.get(row.device) ?? []), viewOf(row, now)])
  return {
    validDays: workshop.validDays,
    devices: [...byDevice].map(([device, views]) => ({ device, current: views[0]!, history: views })),
  }
}
