import { and, desc, eq, sql } from 'drizzle-orm'
import { z } from 'zod'
import { auditEvents, pieces, reviews } from '../database/schema'
import type { Database } from '../database/client'
import { APPROVAL_UNDO_WINDOW_S } from '../../shared/records/approvalWindow'
import { DECISION_MOVES } from '../../shared/records/stages'
import type { Member } from './auth'
import { audit } from './audit'
import { approvalPending } from './approval-window'
import { fail } from './http-errors'
import { lockPiece } from './reviews'

const ApproveDetails = z.object({ reviewId: z.string().uuid(), previousUpdatedAt: z.string().datetime({ offset: true }) }).partial()

/**
 * Takes back a pending approval: the piece returns to review exactly as it was (its stage,
 * no approved strike, its place in the queue) and the approval's review row is removed;
 * the audit keeps both the approval and its undoing. Under the piece's row lock, so an
 * undo racing another undo or a reopen finds the piece moved and gets 409.
 */
export function undoApproval(db: Database, member: Member, pieceId: string) {
  return db.transaction(async (tx) => {
    const piece = await lockPiece(tx, member, pieceId)
    if (piece.stage !== DECISION_MOVES.approve.to) fail(409, 'This piece is not approved, so there is no approval to undo.')
    const [window] = await tx.select({ open: approvalPending() }).from(pieces).where(eq(pieces.id, pieceId))
    if (!window?.open) {
      fail(409, `This approval is final: it could be undone for ${APPROVAL_UNDO_WINDOW_S} seconds only. Reopen the piece with a reason instead.`)
    }
    const [approval] = await tx.select({ details: auditEvents.details }).from(auditEvents)
      .where(and(eq(auditEvents.workshopId, member.workshopId), eq(auditEvents.subjectId, pieceId), eq(auditEvents.action, 'piece.approve')))
      .orderBy(desc(auditEvents.at)).limit(1)
    const details = ApproveDetails.safeParse(approval?.details ?? {})
    const known = details.success ? details.data : {}
    const [review] = await tx.select().from(reviews)
      .where(known.reviewId
        ? and(eq(reviews.id, known.reviewId), eq(reviews.pieceId, pieceId))
        : and(eq(reviews.pieceId, pieceId), eq(reviews.decision, 'approve')))
      .orderBy(desc(reviews.createdAt)).limit(1)
    if (review) await tx.delete(reviews).where(eq(reviews.id, review.id))
    await tx.update(pieces).set({
      stage: DECISION_MOVES.approve.from, approvedStrikeId: null, approvedAt: null, approvalFinalAt: null,
      updatedAt: known.previousUpdatedAt ? new Date(known.previousUpdatedAt) : sql`now()`,
    }).where(eq(pieces.id, pieceId))
    await audit(tx, {
      workshopId: member.workshopId, actorId: member.userId, action: 'piece.approve.undo', subjectType: 'piece', subjectId: pieceId,
      fromState: DECISION_MOVES.approve.to, toState: DECISION_MOVES.approve.from, reason: null,
      details: { strikeId: piece.approvedStrikeId, reviewId: review?.id ?? null, comment: review?.comment ?? null, overrideReason: review?.overrideReason ?? null },
    })
    return { id: pieceId, stage: DECISION_MOVES.approve.from }
  })
}
