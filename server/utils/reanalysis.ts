import { and, asc, count, desc, eq, ne } from 'drizzle-orm'
import { pieces, reanalysisRuns, sets, strikeAnalyses, strikes, type ReanalysisRun } from '../database/schema'
import type { Database, Executor } from '../database/client'
import { ENGINE_VERSION } from '../../shared/analysis/version'
import { MAX_REANALYSIS_STRIKES, type LatestReanalysisInput } from '../../shared/schemas/reanalysis'
import type { ReanalysisResult } from '../../shared/reanalysis/types'
import { audit } from './audit'
import { fail } from './http-errors'

/** Who asks for a re-measurement: a member, or the command line (no user). */
export interface Requester { workshopId: string, userId: string | null }

export type ReanalysisTarget = { pieceId: string } | { setId: string }

/** A run as the API answers it. */
export function runView(run: ReanalysisRun) {
  return {
    id: run.id,
    scope: run.scope,
    setId: run.setId,
    pieceId: run.pieceId,
    status: run.status,
    reason: run.reason,
    engineVersion: run.engineVersion ?? ENGINE_VERSION,
    requestedAt: run.createdAt,
    startedAt: run.startedAt,
    finishedAt: run.finishedAt,
    error: run.error,
    statusUrl: `/api/reanalysis/${run.id}`,
    result: run.result,
  }
}
export type ReanalysisRunView = ReturnType<typeof runView>

/**
 * Queues a re-measurement of a piece's or a set's stored strikes with the current
 * engine. At most one run per set is queued or running (a unique index decides
 * between racing requests: the loser gets a 409). The work runs as a job.
 */
export async function requestReanalysis(db: Database, who: Requester, target: ReanalysisTarget, reason: string, options: { runHere?: boolean } = {}) {
  return db.transaction(async (tx) => {
    let setId: string
    let pieceId: string | null = null
    if ('pieceId' in target) {
      const [piece] = await tx.select({ id: pieces.id, setId: pieces.setId, stage: pieces.stage }).from(pieces)
        .where(and(eq(pieces.id, target.pieceId), eq(pieces.workshopId, who.workshopId)))
      if (!piece) fail(404, 'No such piece in this workshop.')
      if (piece.stage === 'scrapped') fail(409, 'This piece is scrapped; its strikes are not re-measured.')
      setId = piece.setId
      pieceId = piece.id
    }
    else {
      const [set] = await tx.select({ id: sets.id }).from(sets).where(and(eq(sets.id, target.setId), eq(sets.workshopId, who.workshopId)))
      if (!set) fail(404, 'No such set in this workshop.')
      setId = set.id
    }
    // The limit is checked before any work is queued.
    const [n] = await tx.select({ n: count() }).from(strikes).innerJoin(pieces, eq(pieces.id, strikes.pieceId))
      .where(and(eq(strikes.workshopId, who.workshopId), pieceId ? eq(pieces.id, pieceId) : eq(pieces.setId, setId), ne(pieces.stage, 'scrapped')))
    const strikeCount = n?.n ?? 0
    const what = pieceId ? 'this piece' : 'this set'
    if (strikeCount === 0) fail(409, `No strike of ${what} has been recorded yet, so there is nothing to re-measure.`)
    if (strikeCount > MAX_REANALYSIS_STRIKES) {
      fail(422, `${pieceId ? 'This piece' : 'This set'} has ${strikeCount} strikes; one re-measurement takes at most ${MAX_REANALYSIS_STRIKES}. Re-measure its pieces one by one.`)
    }
    const [run] = await tx.insert(reanalysisRuns).values({
      workshopId: who.workshopId, setId, pieceId, scope: pieceId ? 'piece' : 'set', reason, requestedBy: who.userId,
      // A run the caller works itself (the command line) is never handed to the queue.
      jobId: options.runHere ? 'command-line' : null,
      result: { engineVersion: ENGINE_VERSION, strikeCount, pieceCount: 0, done: false, pieces: [] } satisfies ReanalysisResult,
    }).onConflictDoNothing().returning()
    if (!run) fail(409, 'A re-measurement of this set is already queued or running; wait for it to finish.')
    await audit(tx, {
      workshopId: who.workshopId, actorId: who.userId, action: 'reanalysis.request', subjectType: pieceId ? 'piece' : 'set',
      subjectId: pieceId ?? setId, toState: 'queued', reason: reason || null, details: { runId: run.id, strikes: strikeCount, engineVersion: ENGINE_VERSION },
    })
    return runView(run)
  })
}

export async function getReanalysisRun(db: Executor, workshopId: string, runId: string) {
  const [run] = await db.select().from(reanalysisRuns).where(and(eq(reanalysisRuns.id, runId), eq(reanalysisRuns.workshopId, workshopId)))
  if (!run) fail(404, 'No such re-measurement in this workshop.')
  return runView(run)
}

/** The latest run of a set (any scope within it) or of a piece, as `{ run }` (null when there was none); 404 for another workshop's. */
export async function latestReanalysis(db: Executor, workshopId: string, query: LatestReanalysisInput) {
  const [owned] = query.piece
    ? await db.select({ id: pieces.id }).from(pieces).where(and(eq(pieces.id, query.piece), eq(pieces.workshopId, workshopId)))
    : await db.select({ id: sets.id }).from(sets).where(and(eq(sets.id, query.set!), eq(sets.workshopId, workshopId)))
  if (!owned) fail(404, query.piece ? 'No such piece in this workshop.' : 'No such set in this workshop.')
  const [run] = await db.select().from(reanalysisRuns)
    .where(and(eq(reanalysisRuns.workshopId, workshopId), query.piece ? eq(reanalysisRuns.pieceId, query.piece) : eq(reanalysisRuns.setId, query.set!)))
    .orderBy(desc(reanalysisRuns.createdAt)).limit(1)
  return { run: run ? runView(run) : null }
}

/** Every result a strike has had, oldest first; 404 for another workshop's strike. */
export async function strikeHistory(db: Executor, workshopId: string, strikeId: string) {
  const [strike] = await db.select({ id: strikes.id }).from(strikes).where(and(eq(strikes.id, strikeId), eq(strikes.workshopId, workshopId)))
  if (!strike) fail(404, 'No such strike in this workshop.')
  return db.select({
    id: strikeAnalyses.id, engineVersion: strikeAnalyses.engineVersion, verdict: strikeAnalyses.verdict, worstCents: strikeAnalyses.worstCents,
    fundamentalHz: strikeAnalyses.fundamentalHz, applied: strikeAnalyses.applied, reason: strikeAnalyses.reason, runId: strikeAnalyses.runId,
    createdBy: strikeAnalyses.createdBy, createdAt: strikeAnalyses.createdAt,
  }).from(strikeAnalyses).where(and(eq(strikeAnalyses.strikeId, strikeId), eq(strikeAnalyses.workshopId, workshopId)))
    .orderBy(asc(strikeAnalyses.createdAt), asc(strikeAnalyses.id))
}
