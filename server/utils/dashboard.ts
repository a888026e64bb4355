import { and, asc, avg, count, eq, gte, inArray, isNull, sql } from 'drizzle-orm'
import { memberships, pieces, sets, strikes, users, workshops } from '../database/schema'
import type { Executor } from '../database/client'
import { weekStartIn } from '../../shared/format/weekStart'
import { FINISHED_STAGES } from '../../shared/records/stages'
import { StoredMatchesSchema } from '../../shared/schemas/analysis'
import { REVIEW_TRAIL_STRIKES, type ReviewQuery } from '../../shared/schemas/review'
import { approvalPending } from './approval-window'
import { listSets } from './sets'

/**
 * A set's pieces by stage as the dashboard counts them: an approval that can still be
 * undone is not counted as approved yet; it stays with the pieces in review.
 */
function settledStages(byStage: Record<string, number>, approvedCount: number, pendingApprovals: number) {
  // Only an approved piece can be pending (undo, reopen and signing all need it final or clear it).
  const pending = Math.min(pendingApprovals, byStage.approved ?? 0)
  if (!pending) return { byStage, approvedCount }
  const approved = (byStage.approved ?? 0) - pending
  const { approved: _, ...rest } = byStage
  return { byStage: { ...rest, ...(approved > 0 ? { approved } : {}), review: (byStage.review ?? 0) + pending }, approvedCount: approvedCount - pending }
}

export async function dashboardFor(db: Executor, workshopId: string) {
  const [workshop] = await db.select({ timeZone: workshops.timeZone }).from(workshops).where(eq(workshops.id, workshopId))
  // "This week" is the workshop's week: from Monday 00:00 where the workshop is.
  const since = weekStartIn(new Date(), workshop?.timeZone ?? 'UTC')
  // Approved and beyond, without approvals still in their undo window.
  const settled = and(eq(pieces.workshopId, workshopId), inArray(pieces.stage, FINISHED_STAGES), sql`not ${approvalPending()}`)
  const [setRows, [queue], [done], [firstPass], [perPiece], weekly] = await Promise.all([
    listSets(db, workshopId),
    db.select({ n: count() }).from(pieces).where(and(eq(pieces.workshopId, workshopId), eq(pieces.stage, 'review'))),
    db.select({ n: count() }).from(pieces).where(settled),
    db.select({ n: count() }).from(pieces).where(and(settled, eq(pieces.reworkCount, 0))),
    db.select({ v: avg(pieces.strikeCount) }).from(pieces).where(settled),
    db.select({ userId: users.id, name: users.name, strikes: sql<number>`count(${strikes.id})::int` })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .leftJoin(strikes, and(eq(strikes.userId, users.id), eq(strikes.workshopId, workshopId), gte(strikes.createdAt, since)))
      .where(and(eq(memberships.workshopId, workshopId), inArray(memberships.role, ['benchmaker', 'supervisor', 'owner'])))
      .groupBy(users.id, users.name)
      .orderBy(asc(users.name)),
  ])
  const approved = done?.n ?? 0
  return {
    sets: setRows.filter(s => !s.shippedAt).map(s => ({
      id: s.id, name: s.name, serial: s.serial, pieceCount: s.pieceCount, certifiable: s.certifiable,
      pendingApprovalCount: s.pendingApprovalCount, ...settledStages(s.byStage, s.approvedCount, s.pendingApprovalCount),
    })),
    reviewQueue: queue?.n ?? 0,
    pendingApprovals: setRows.reduce((n, s) => n + s.pendingApprovalCount, 0),
    approvedPieces: approved,
    firstPassYield: approved > 0 ? (firstPass?.n ?? 0) / approved : null,
    strikesPerApprovedPiece: perPiece?.v != null ? Number(perPiece.v) : null,
    weekStartsAt: since,
    strikesThisWeek: weekly,
  }
}

/**
 * Pieces waiting for a supervisor, oldest first, with the latest strike's matches and the
 * worst cents of the last few strikes (oldest first); optionally one set's or one
 * benchmaker's (the assignee; `none`: unassigned). Always within the member's workshop.
 */
export async function reviewQueue(db: Executor, workshopId: string, filter: Omit<ReviewQuery, 'group'> = {}) {
  const trail = sql<(number | null)[]>`(select coalesce(json_agg(t.w order by t.at), '[]'::json) from (select ${strikes.worstCents} as w, ${strikes.createdAt} as at from ${strikes} where ${strikes.pieceId} = ${pieces.id} order by ${strikes.createdAt} desc limit ${REVIEW_TRAIL_STRIKES}) t)`
  return db.select({
    id: pieces.id, note: pieces.note, position: pieces.position, targetHz: pieces.targetHz, setId: sets.id, setName: sets.name,
    strikeCount: pieces.strikeCount, reworkCount: pieces.reworkCount, latestStrikeId: pieces.latestStrikeId,
    latestVerdict: pieces.latestVerdict, latestWorstCents: pieces.latestWorstCents, updatedAt: pieces.updatedAt,
    assigneeId: pieces.assigneeId, assigneeName: users.name, worstCentsTrail: trail,
    matches: sql<unknown>`(select ${strikes.analysis} -> 'matches' from ${strikes} where ${strikes.id} = ${pieces.latestStrikeId})`.mapWith(v => StoredMatchesSchema.parse(v)),
    temperatureC: sql<number | null>`(select ${strikes.temperatureC} from ${strikes} where ${strikes.id} = ${pieces.latestStrikeId})`,
  }).from(pieces)
    .innerJoin(sets, eq(sets.id, pieces.setId))
    .leftJoin(users, eq(users.id, pieces.assigneeId))
    .where(and(
      eq(pieces.workshopId, workshopId), eq(pieces.stage, 'review'),
      filter.set ? eq(pieces.setId, filter.set) : undefined,
      filter.benchmaker === 'none' ? isNull(pieces.assigneeId) : filter.benchmaker ? eq(pieces.assigneeId, filter.benchmaker) : undefined,
    ))
    .orderBy(asc(pieces.updatedAt))
    .limit(200)
}
