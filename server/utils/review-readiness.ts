import { and, desc, eq } from 'drizzle-orm'
import { pieces, strikes, workshops } from '../database/schema'
import type { Executor } from '../database/client'
import { STRIKES_BEFORE_REVIEW } from '../../shared/uncertainty/evidence'
import { strikeMoreText } from '../../shared/uncertainty/ruleWords'
import { finalStateStrikes } from './final-state'
import { fail } from './http-errors'

/** How many strikes the piece has at its final state, and how many the workshop asks for before review (0: no rule). */
export async function reviewReadiness(db: Executor, workshopId: string, pieceId: string) {
  const [workshop] = await db.select({ on: workshops.repeatStrikesBeforeReview }).from(workshops).where(eq(workshops.id, workshopId))
  const needed = workshop?.on ? STRIKES_BEFORE_REVIEW : 0
  const [latest] = await db.select({ id: strikes.id }).from(strikes)
    .where(and(eq(strikes.pieceId, pieceId), eq(strikes.workshopId, workshopId))).orderBy(desc(strikes.createdAt)).limit(1)
  const atFinalState = latest ? (await finalStateStrikes(db, workshopId, pieceId, latest.id)).length : 0
  const missing = Math.max(0, needed - atFinalState)
  return { needed, atFinalState, missing, advice: missing ? strikeMoreText(missing) : null }
}

/** Why this piece may not go to review yet under the workshop's three-strike rule, or null. */
export async function reviewStrikesProblem(db: Executor, workshopId: string, pieceId: string): Promise<string | null> {
  const r = await reviewReadiness(db, workshopId, pieceId)
  if (r.missing === 0) return null
  return `This workshop asks for ${r.needed} strikes of a piece in its final form (since its last cut plan or return) before review, and it has ${r.atFinalState}: ${strikeMoreText(r.missing)}.`
}

/** The readiness of a piece of this workshop (404 for any other). */
export async function reviewReadinessOfPiece(db: Executor, workshopId: string, pieceId: string) {
  const [piece] = await db.select({ id: pieces.id }).from(pieces).where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, workshopId)))
  if (!piece) fail(404, 'No such piece in this workshop.')
  return reviewReadiness(db, workshopId, pieceId)
}
