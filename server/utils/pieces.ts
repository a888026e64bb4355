import { and, asc, count, desc, eq, ilike, inArray, isNull, or, sql, type SQL } from 'drizzle-orm'
import { lots, pieces, reviews, sets, strikes, templateVersions, users } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { PieceQuery } from '../../shared/schemas/records'
import { parseStoredAnalysis, StoredMatchesSchema } from '../../shared/schemas/analysis'
import { arrivalProblem, assigneeAfter, assigneeProblem, stagePath, type PieceStage } from '../../shared/records/stages'
import type { Member } from './auth'
import { audit } from './audit'
import { fail } from './http-errors'
import { reviewStrikesProblem } from './review-readiness'

const SORTS: Record<string, SQL[]> = {
  'position': [asc(sets.createdAt), asc(pieces.position)],
  '-position': [desc(sets.createdAt), desc(pieces.position)],
  'note': [asc(pieces.midi), asc(pieces.id)],
  '-note': [desc(pieces.midi), asc(pieces.id)],
  'stage': [asc(pieces.stage), asc(pieces.id)],
  '-stage': [desc(pieces.stage), asc(pieces.id)],
  'updated': [asc(pieces.updatedAt), asc(pieces.id)],
  '-updated': [desc(pieces.updatedAt), asc(pieces.id)],
  'cents': [sql`abs(${pieces.latestWorstCents}) asc nulls last`, asc(pieces.id)],
  '-cents': [sql`abs(${pieces.latestWorstCents}) desc nulls last`, asc(pieces.id)],
  'strikes': [asc(pieces.strikeCount), asc(pieces.id)],
  '-strikes': [desc(pieces.strikeCount), asc(pieces.id)],
}

/** One filtered, sorted page of the workshop's pieces, with the total count. */
export async function listPieces(db: Executor, member: Member, query: PieceQuery) {
  const where: SQL[] = [eq(pieces.workshopId, member.workshopId)]
  if (query.set) where.push(eq(pieces.setId, query.set))
  if (query.stage?.length) where.push(inArray(pieces.stage, query.stage))
  if (query.verdict === 'none') where.push(isNull(pieces.latestVerdict))
  else if (query.verdict) where.push(eq(pieces.latestVerdict, query.verdict))
  if (query.assignee === 'me') where.push(eq(pieces.assigneeId, member.userId))
  else if (query.assignee === 'none') where.push(isNull(pieces.assigneeId))
  else if (query.assignee) where.push(eq(pieces.assigneeId, query.assignee))
  if (query.q) {
    const like = `%${query.q.replace(/[%_\\]/g, m => `\\${m}`)}%`
    where.push(or(ilike(pieces.note, like), ilike(sets.name, like), ilike(sets.serial, like))!)
  }
  const filter = and(...where)
  const [items, [total]] = await Promise.all([
    db.select({
      id: pieces.id, setId: pieces.setId, setName: sets.name, setSerial: sets.serial, position: pieces.position,
      note: pieces.note, targetHz: pieces.targetHz, stage: pieces.stage, latestVerdict: pieces.latestVerdict,
      latestWorstCents: pieces.latestWorstCents, latestFundamentalHz: pieces.latestFundamentalHz,
      strikeCount: pieces.strikeCount, assigneeId: pieces.assigneeId, assigneeName: users.name,
      updatedAt: pieces.updatedAt, latestStrikeAt: pieces.latestStrikeAt, lotId: pieces.lotId, lotCode: lots.code,
    }).from(pieces)
      .innerJoin(sets, eq(sets.id, pieces.setId))
      .leftJoin(users, eq(users.id, pieces.assigneeId))
      .leftJoin(lots, eq(lots.id, pieces.lotId))
      .where(filter)
      .orderBy(...SORTS[query.sort]!)
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize),
    // Only a text search needs the sets; without it the count reads the pieces' indexes alone.
    query.q
      ? db.select({ n: count() }).from(pieces).innerJoin(sets, eq(sets.id, pieces.setId)).where(filter)
      : db.select({ n: count() }).from(pieces).where(filter),
  ])
  return { items, total: total?.n ?? 0, page: query.page, pageSize: query.pageSize }
}

/** A piece with its set, template version, lot, strikes (newest first, without the full analysis) and reviews. */
export async function getPiece(db: Executor, workshopId: string, pieceId: string) {
  const [row] = await db.select({ piece: pieces, set: sets, template: templateVersions, lot: lots, assigneeName: users.name })
    .from(pieces)
    .innerJoin(sets, eq(sets.id, pieces.setId))
    .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
    .leftJoin(lots, eq(lots.id, pieces.lotId))
    .leftJoin(users, eq(users.id, pieces.assigneeId))
    .where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, workshopId)))
  if (!row) fail(404, 'No such piece in this workshop.')
  const strikeRows = await db.select({
    id: strikes.id, createdAt: strikes.createdAt, stage: strikes.stage, userId: strikes.userId, userName: users.name,
    temperatureC: strikes.temperatureC, humidityPct: strikes.humidityPct, fundamentalHz: strikes.fundamentalHz,
    worstCents: strikes.worstCents, verdict: strikes.verdict, engineVersion: strikes.engineVersion,
    matches: sql<unknown>`${strikes.analysis} -> 'matches'`.mapWith(v => StoredMatchesSchema.parse(v)),
  }).from(strikes).leftJoin(users, eq(users.id, strikes.userId))
    .where(and(eq(strikes.pieceId, pieceId), eq(strikes.workshopId, workshopId)))
    .orderBy(desc(strikes.createdAt))
    .limit(200)
  const reviewRows = await db.select({
    id: reviews.id, decision: reviews.decision, comment: reviews.comment, overrideReason: reviews.overrideReason,
    strikeId: reviews.strikeId, supervisorName: users.name, createdAt: reviews.createdAt,
  }).from(reviews).leftJoin(users, eq(users.id, reviews.supervisorId))
    .where(eq(reviews.pieceId, pieceId)).orderBy(desc(reviews.createdAt))
  return {
    ...row.piece,
    assigneeName: row.assigneeName,
    set: { id: row.set.id, name: row.set.name, serial: row.set.serial, model: row.set.model, referenceHz: row.set.referenceHz },
    template: row.template,
    lot: row.lot,
    strikes: strikeRows,
    reviews: reviewRows,
  }
}

/** One strike with the engine's full result. */
export async function getStrike(db: Executor, workshopId: string, strikeId: string) {
  const [row] = await db.select().from(strikes).where(and(eq(strikes.id, strikeId), eq(strikes.workshopId, workshopId)))
  if (!row) fail(404, 'No such strike in this workshop.')
  // Older engines' results are read in the current shape.
  return { ...row, analysis: parseStoredAnalysis(row.analysis) }
}

async function movePiece(tx: Executor, member: Member, pieceId: string, to: PieceStage, reason?: string, via?: PieceStage) {
  const [piece] = await tx.select().from(pieces)
    .where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, member.workshopId))).for('update')
  if (!piece) fail(404, 'No such piece in this workshop.')
  const label = `${piece.note} (piece ${piece.position})`
  // What the role may never do is a 403; a move the piece's stage does not allow is a 409.
  const path = stagePath(member.role, piece.stage, to, via)
  if (path.problem !== null) fail(path.status, `${label}: ${path.problem}`)
  const notYours = assigneeProblem(member.role, member.userId, piece.assigneeId)
  if (notYours) fail(403, `${label} ${notYours}`)
  const notYet = arrivalProblem(to, piece.strikeCount)
  if (notYet) fail(409, `${label} ${notYet}`)
  const fewStrikes = to === 'review' ? await reviewStrikesProblem(tx, member.workshopId, pieceId) : null
  if (fewStrikes) fail(409, `${label}: ${fewStrikes}`)
  const assigneeId = assigneeAfter(member.role, member.userId, piece.assigneeId)
  const [updated] = await tx.update(pieces).set({ stage: to, assigneeId, updatedAt: new Date() }).where(eq(pieces.id, pieceId)).returning()
  // Each step of a composite move is audited as the plain move it stands for.
  let from = piece.stage
  for (const step of path.steps) {
    await audit(tx, { workshopId: member.workshopId, actorId: member.userId, action: 'piece.stage', subjectType: 'piece', subjectId: pieceId, fromState: from, toState: step, reason })
    from = step
  }
  return updated!
}

/** One piece to `to`, through `via` when it is a composite move of the stage table; all steps or none. */
export function changeStage(db: Database, member: Member, pieceId: string, to: PieceStage, reason?: string, via?: PieceStage) {
  return db.transaction(tx => movePiece(tx, member, pieceId, to, reason, via))
}

/** All or nothing: one piece that may not move stops the whole change. */
export function changeStages(db: Database, member: Member, pieceIds: string[], to: PieceStage, reason?: string) {
  return db.transaction(async (tx) => {
    const moved = []
    for (const id of [...new Set(pieceIds)].sort()) moved.push(await movePiece(tx, member, id, to, reason))
    return { moved: moved.length, to }
  })
}

export async function assignPiece(db: Database, member: Member, pieceId: string, assigneeId: string | null) {
  return db.transaction(async (tx) => {
    const [piece] = await tx.select().from(pieces).where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, member.workshopId))).for('update')
    if (!piece) fail(404, 'No such piece in this workshop.')
    if (assigneeId) {
      const [m] = await tx.execute<{ role: string }>(sql`select role from memberships where workshop_id = ${member.workshopId} and user_id = ${assigneeId}`)
      if (!m) fail(404, 'No such member in this workshop.')
    }
    const [updated] = await tx.update(pieces).set({ assigneeId, updatedAt: new Date() }).where(eq(pieces.id, pieceId)).returning()
    await audit(tx, { workshopId: member.workshopId, actorId: member.userId, action: 'piece.assign', subjectType: 'piece', subjectId: pieceId, fromState: piece.assigneeId, toState: assigneeId })
    return updated!
  })
}
