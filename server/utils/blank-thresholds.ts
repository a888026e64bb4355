import { and, eq, sql } from 'drizzle-orm'
import { workshops } from '../database/schema'
import type { Database, Executor } from '../database/client'
import { BLANK_THRESHOLDS } from '../../shared/barModel/blankThresholds'
import type { BlankThresholds } from '../../shared/schemas/blankThresholds'
import type { Member } from './auth'
import { audit } from './audit'
import { fail } from './http-errors'

/** The workshop's own blank thresholds per species (a species left out grades by the starting ones). */
export async function workshopBlankThresholds(db: Executor, workshopId: string): Promise<BlankThresholds> {
  const [row] = await db.select({ thresholds: workshops.blankThresholds }).from(workshops).where(eq(workshops.id, workshopId))
  if (!row) fail(404, 'No such workshop.')
  return row.thresholds
}

/** GET's answer: the workshop's own thresholds beside the starting ones the screen offers in their place. */
export async function getBlankThresholds(db: Executor, workshopId: string) {
  return { thresholds: await workshopBlankThresholds(db, workshopId), starting: BLANK_THRESHOLDS }
}

/**
 * Replaces the workshop's own thresholds under its row lock and audits them from what to what
 * (only when they changed); two owners saving at once apply one after the other.
 */
export function putBlankThresholds(db: Database, member: Member, thresholds: BlankThresholds) {
  return db.transaction(async (tx) => {
    const [before] = await tx.select({ thresholds: workshops.blankThresholds }).from(workshops).where(eq(workshops.id, member.workshopId)).for('update')
    if (!before) fail(404, 'No such workshop.')
    // jsonb keeps its own key order, so PostgreSQL says whether anything changed.
    const changed = await tx.update(workshops).set({ blankThresholds: thresholds })
      .where(and(eq(workshops.id, member.workshopId), sql`${workshops.blankThresholds} is distinct from ${JSON.stringify(thresholds)}::jsonb`))
      .returning({ id: workshops.id })
    if (changed.length) {
      await audit(tx, {
        workshopId: member.workshopId, actorId: member.userId, action: 'workshop.blankThresholds', subjectType: 'workshop', subjectId: member.workshopId,
        details: { from: before.thresholds, to: thresholds },
      })
    }
    return { thresholds, starting: BLANK_THRESHOLDS }
  })
}
