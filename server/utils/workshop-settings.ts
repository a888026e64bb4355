import { eq } from 'drizzle-orm'
import { workshops } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { WorkshopSettings } from '../../shared/schemas/workshop'
import type { Member } from './auth'
import { audit } from './audit'
import { fail } from './http-errors'

const SETTINGS_COLUMNS = {
  timeZone: workshops.timeZone, locale: workshops.locale, temperatureUnit: workshops.temperatureUnit, referenceHz: workshops.referenceHz,
  calibrationValidDays: workshops.calibrationValidDays,
  repeatStrikesBeforeReview: workshops.repeatStrikesBeforeReview,
}

/** A workshop's time zone, date locale, temperature unit and default reference pitch. */
export async function getWorkshopSettings(db: Executor, workshopId: string): Promise<WorkshopSettings> {
  const [row] = await db.select(SETTINGS_COLUMNS).from(workshops).where(eq(workshops.id, workshopId))
  if (!row) fail(404, 'No such workshop.')
  return row
}

/**
 * Changes some settings of the member's own workshop under its row lock, and audits what
 * changed from what (two owners saving at once apply one after the other, field by field).
 */
export function updateWorkshopSettings(db: Database, member: Member, patch: Partial<WorkshopSettings>): Promise<WorkshopSettings> {
  return db.transaction(async (tx) => {
    const [before] = await tx.select(SETTINGS_COLUMNS).from(workshops).where(eq(workshops.id, member.workshopId)).for('update')
    if (!before) fail(404, 'No such workshop.')
    const [after] = await tx.update(workshops).set(patch).where(eq(workshops.id, member.workshopId)).returning(SETTINGS_COLUMNS)
    const changed = (Object.keys(patch) as (keyof WorkshopSettings)[]).filter(k => before[k] !== after![k])
    if (changed.length) {
      await audit(tx, {
        workshopId: member.workshopId, actorId: member.userId, action: 'workshop.settings', subjectType: 'workshop', subjectId: member.workshopId,
        details: Object.fromEntries(changed.map(k => [k, { from: before[k], to: after![k] }])),
      })
    }
    return after!
  })
}
