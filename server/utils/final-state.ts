import { and, desc, eq, gt, inArray, lte, sql } from 'drizzle-orm'
import { cutPlans, reviews, strikes } from '../database/schema'
import type { Executor } from '../database/client'
import { FINAL_STATE_STRIKES_MAX } from '../../shared/uncertainty/evidence'

/**
 * A piece's final state is the form it has had since material was last taken off or it was
 * sent back: the strikes made after its latest saved cut plan and after it was last returned
 * for rework or reopened, up to the reference strike (the approved one, else the latest).
 * Those strikes, newest first and at most FINAL_STATE_STRIKES_MAX, are what the repeatability
 * of its budget reads and what "three strikes before review" counts.
 */
export async function finalStateStrikes(db: Executor, workshopId: string, pieceId: string, referenceAt: Date) {
  const [row] = await db.select({
    at: sql<Date | null>`greatest(
      (select max(${cutPlans.createdAt}) from ${cutPlans} where ${cutPlans.pieceId} = ${pieceId} and ${cutPlans.createdAt} <= ${referenceAt}),
      (select max(${reviews.createdAt}) from ${reviews} where ${reviews.pieceId} = ${pieceId} and ${inArray(reviews.decision, ['return', 'reopen'])} and ${reviews.createdAt} <= ${referenceAt})
    )`.mapWith(v => (v === null ? null : new Date(v))),
  }).from(sql`(select 1) as one`)
  const since = row?.at ?? null
  return db.select().from(strikes)
    .where(and(
      eq(strikes.pieceId, pieceId), eq(strikes.workshopId, workshopId), lte(strikes.createdAt, referenceAt),
      ...(since ? [gt(strikes.createdAt, since)] : []),
    ))
    .orderBy(desc(strikes.createdAt))
    .limit(FINAL_STATE_STRIKES_MAX)
}
