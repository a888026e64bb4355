import { and, desc, eq, gt, inArray, lte, max, sql } from 'drizzle-orm'
import { cutPlans, reviews, strikes } from '../database/schema'
import type { Executor } from '../database/client'
import { FINAL_STATE_STRIKES_MAX } from '../../shared/uncertainty/evidence'
import { unchangedRun } from '../../shared/uncertainty/unchangedRun'

/**
 * A piece's final state is the form it has had since material was last taken off or it was
 * sent back: the strikes made after its latest saved cut plan and after it was last returned
 * for rework or reopened, up to the reference strike (the approved one, else the latest), and
 * only as far back as their fundamentals agree with the reference's (unchangedRun: a cut made
 * without a saved plan ends the final state too).
 * Those strikes, newest first and at most FINAL_STATE_STRIKES_MAX, are what the repeatability
 * of its budget reads and what "three strikes before review" counts.
 */
export async function finalStateStrikes(db: Executor, workshopId: string, pieceId: string, referenceStrikeId: string) {
  // The reference's own instant, read in SQL: a JavaScript Date would drop its microseconds.
  const referenceAt = sql`(select ${strikes.createdAt} from ${strikes} where ${strikes.id} = ${referenceStrikeId})`
  const [cut] = await db.select({ at: max(cutPlans.createdAt) }).from(cutPlans)
    .where(and(eq(cutPlans.pieceId, pieceId), lte(cutPlans.createdAt, referenceAt)))
  const [back] = await db.select({ at: max(reviews.createdAt) }).from(reviews)
    .where(and(eq(reviews.pieceId, pieceId), inArray(reviews.decision, ['return', 'reopen']), lte(reviews.createdAt, referenceAt)))
  const times = [cut?.at, back?.at].flatMap(t => (t ? [new Date(t).getTime()] : []))
  const since = times.length ? new Date(Math.max(...times)) : null
  const rows = await db.select().from(strikes)
    .where(and(
      eq(strikes.pieceId, pieceId), eq(strikes.workshopId, workshopId), lte(strikes.createdAt, referenceAt),
      ...(since ? [gt(strikes.createdAt, since)] : []),
    ))
    .orderBy(desc(strikes.createdAt))
    .limit(FINAL_STATE_STRIKES_MAX)
  return rows.slice(0, unchangedRun(rows.map(r => r.fundamentalHz)))
}
