import { and, desc, eq } from 'drizzle-orm'
import { strikes, workshops } from '../database/schema'
import type { Executor } from '../database/client'
import { STRIKES_BEFORE_REVIEW } from '../../shared/uncertainty/evidence'
import { finalStateStrikes } from './final-state'

const TIMES = ['', 'once', 'twice', 'three times']

/** "strike twice more before review": what the Bench and a refused review say. */
export function strikeMoreText(missing: number) {
  return `strike ${TIMES[missing] ?? `${missing} times`} more before review`
}

/** How many strikes the piece has at its final state, and how many the workshop asks for before review (0: no rule). */
export async function reviewReadiness(db: Executor, workshopId: string, pieceId: string) {
  const [workshop] = await db.select({ on: workshops.repeatStrikesBeforeReview }).from(workshops).where(eq(workshops.id, workshopId))
  const needed = workshop?.on ? STRIKES_BEFORE_REVIEW : 0
  const [latest] = await db.select({ createdAt: strikes.createdAt }).from(strikes)
    .where(and(eq(strikes.pieceId, pieceId), eq(strikes.workshopId, workshopId))).orderBy(desc(strikes.createdAt)).limit(1)
  const atFinalState = latest ? (await finalStateStrikes(db, workshopId, pieceId, latest.createdAt)).length : 0
  return { needed, atFinalState, missing: Math.max(0, needed - atFinalState) }
}

/** Why this piece may not go to review yet under the workshop's three-strike rule, or null. */
export async function reviewStrikesProblem(db: Executor, workshopId: string, pieceId: string): Promise<string | null> {
  const r = await reviewReadiness(db, workshopId, pieceId)
  if (r.missing === 0) return null
  return `This workshop asks for ${r.needed} strikes of a piece in its final form (since its last cut plan or return) before review, and it has ${r.atFinalState}: ${strikeMoreText(r.missing)}.`
}
