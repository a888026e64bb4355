import { and, eq, sql } from 'drizzle-orm'
import { pieces, reviews, strikes } from '../database/schema'
import type { Database, Executor } from '../database/client'
import { DECISION_MOVES, isFinished } from '../../shared/records/stages'
import { APPROVAL_UNDO_WINDOW_S } from '../../shared/records/approvalWindow'
import type { Member } from './auth'
import { audit } from './audit'
import { fail } from './http-errors'

export async function lockPiece(tx: Executor, member: Member, pieceId: string) {
  const [piece] = await tx.select().from(pieces)
    .where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, member.workshopId))).for('update')
  if (!piece) fail(404, 'No such piece in this workshop.')
  return piece
}

/**
 * Approves a piece in review on its latest strike. The row lock makes two
 * simultaneous approvals queue: the second finds the piece approved and gets 409.
 * The approval stays pending (undoable) until `approval_final_at`, taken from the
 * database's clock so every app instance agrees; the answer says until when.
 */
export function approvePiece(db: Database, member: Member, pieceId: string, input: { strikeId: string, overrideReason?: string, comment?: string }) {
  return db.transaction(async (tx) => {
    const piece = await lockPiece(tx, member, pieceId)
    if (isFinished(piece.stage)) fail(409, 'This piece is already approved.')
    if (piece.stage !== DECISION_MOVES.approve.from) fail(409, 'Only a piece in review can be approved.')
    const [strike] = await tx.select({ id: strikes.id, verdict: strikes.verdict }).from(strikes)
      .where(and(eq(strikes.id, input.strikeId), eq(strikes.pieceId, pieceId)))
    if (!strike) fail(404, 'That strike does not belong to this piece.')
    if (strike.id !== piece.latestStrikeId) fail(409, 'A newer strike exists: approve on the latest strike.')
    if (strike.verdict !== 'within' && !input.overrideReason) {
      fail(409, `The latest strike is ${strike.verdict ?? 'not measured against a template'}: approve only with an override reason.`)
    }
    const [review] = await tx.insert(reviews).values({
      workshopId: member.workshopId, pieceId, strikeId: strike.id, supervisorId: member.userId, decision: 'approve',
      comment: input.comment ?? '', overrideReason: strike.verdict === 'within' ? null : input.overrideReason ?? null,
    }).returning()
    const [approved] = await tx.update(pieces).set({
      stage: DECISION_MOVES.approve.to, approvedStrikeId: strike.id, approvedAt: sql`now()`,
      approvalFinalAt: sql`now() + make_interval(secs => ${APPROVAL_UNDO_WINDOW_S})`, updatedAt: new Date(),
    }).where(eq(pieces.id, pieceId)).returning({ undoUntil: pieces.approvalFinalAt })
    // previousUpdatedAt lets an undo put the piece back in its place in the queue.
    await audit(tx, {
      workshopId: member.workshopId, actorId: member.userId, action: 'piece.approve', subjectType: 'piece', subjectId: pieceId,
      fromState: DECISION_MOVES.approve.from, toState: DECISION_MOVES.approve.to, reason: input.overrideReason ?? input.comment ?? null,
      details: { strikeId: strike.id, override: strike.verdict !== 'within', reviewId: review!.id, previousUpdatedAt: piece.updatedAt.toISOString() },
    })
    return { ...review!, undoUntil: approved!.undoUntil }
  })
}

export function returnPiece(db: Database, member: Member, pieceId: string, comment: string) {
  return db.transaction(async (tx) => {
    const piece = await lockPiece(tx, member, pieceId)
    if (piece.stage !== DECISION_MOVES.return.from) fail(409, 'Only a piece in review can be returned for rework.')
    const [review] = await tx.insert(reviews).values({
      workshopId: member.workshopId, pieceId, strikeId: piece.latestStrikeId, supervisorId: member.userId, decision: 'return', comment,
    }).returning()
    await tx.update(pieces).set({ stage: DECISION_MOVES.return.to, reworkCount: sql`${pieces.reworkCount} + 1`, updatedAt: new Date() }).where(eq(pieces.id, pieceId))
    await audit(tx, { workshopId: member.workshopId, actorId: member.userId, action: 'piece.return', subjectType: 'piece', subjectId: pieceId, fromState: DECISION_MOVES.return.from, toState: DECISION_MOVES.return.to, reason: comment })
    return review!
  })
}

/** Reopening an approval is its own audited action with a reason; a certified piece needs its certificate revoked first. */
export function reopenPiece(db: Database, member: Member, pieceId: string, reason: string) {
  return db.transaction(async (tx) => {
    const piece = await lockPiece(tx, member, pieceId)
    if (piece.stage === 'certified' || piece.stage === 'shipped') fail(409, 'This piece is on a certificate: revoke the certificate before reopening it.')
    if (piece.stage !== DECISION_MOVES.reopen.from) fail(409, 'Only an approved piece can be reopened.')
    const [review] = await tx.insert(reviews).values({
      workshopId: member.workshopId, pieceId, strikeId: piece.approvedStrikeId, supervisorId: member.userId, decision: 'reopen', comment: reason,
    }).returning()
    await tx.update(pieces).set({ stage: DECISION_MOVES.reopen.to, approvedStrikeId: null, approvedAt: null, approvalFinalAt: null, updatedAt: new Date() }).where(eq(pieces.id, pieceId))
    await audit(tx, { workshopId: member.workshopId, actorId: member.userId, action: 'piece.reopen', subjectType: 'piece', subjectId: pieceId, fromState: DECISION_MOVES.reopen.from, toState: DECISION_MOVES.reopen.to, reason })
    return review!
  })
}
