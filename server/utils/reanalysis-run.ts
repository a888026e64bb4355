import { setImmediate as nextTurn } from 'node:timers/promises'
import { and, asc, eq, inArray, ne, sql } from 'drizzle-orm'
import { calibrations, pieces, reanalysisRuns, sets, strikeAnalyses, strikes, templateVersions, type ReanalysisRun } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { AnalysisResult } from '../../shared/analysis/types'
import { ENGINE_VERSION } from '../../shared/analysis/version'
import { compareResults, summarise } from '../../shared/reanalysis/compareResults'
import { isFinished } from '../../shared/records/stages'
import type { ReanalysedPiece, ReanalysedStrike, ReanalysisResult } from '../../shared/reanalysis/types'
import { runAnalysis } from './analysis'
import { audit } from './audit'
import { measureWhenFree } from './measure-when-free'
import type { BlobStorage } from './storage'
import { worstCents } from './strikes'

type Measure = (bytes: Uint8Array, options: Parameters<typeof runAnalysis>[1]) => Promise<AnalysisResult>

interface Measured { strike: typeof strikes.$inferSelect, analysis: AnalysisResult | null, error: string | null }

/** A run's result so far (every run is created with one; an empty one stands in for a row without). */
function resultOf(run: ReanalysisRun): ReanalysisResult {
  return run.result ?? { engineVersion: ENGINE_VERSION, strikeCount: 0, pieceCount: 0, done: false, pieces: [] }
}

function plainError(error: unknown): string {
  const e = error as { statusCode?: number, message?: string }
  // Engine refusals come as 4xx with a plain sentence; anything else is not the user's to read.
  return e?.statusCode && e.statusCode < 500 && e.message ? e.message : 'The engine could not measure this recording.'
}

/** Stores the first result of strikes that have no history yet (strikes seeded or recorded before the history existed). */
async function backfillHistory(tx: Executor, strikeIds: string[]) {
  if (!strikeIds.length) return
  await tx.execute(sql`insert into strike_analyses (workshop_id, strike_id, engine_version, analysis, verdict, worst_cents, fundamental_hz, applied, reason, created_by, created_at)
    select s.workshop_id, s.id, s.engine_version, s.analysis, s.verdict, s.worst_cents, s.fundamental_hz, true, 'recorded', s.user_id, s.created_at
    from strikes s where s.id in (${sql.join(strikeIds.map(id => sql`${id}::uuid`), sql`, `)})
    and not exists (select 1 from strike_analyses a where a.strike_id = s.id)`)
}

/** Writes one piece's new results in one transaction, and the piece's entry into the run's result. */
async function commitPiece(db: Database, run: ReanalysisRun, pieceId: string, measured: Measured[]): Promise<ReanalysedPiece | null> {
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(reanalysisRuns).where(eq(reanalysisRuns.id, run.id)).for('update')
    if (!current || current.status !== 'running') return null
    const [piece] = await tx.select().from(pieces).where(eq(pieces.id, pieceId)).for('update')
    if (!piece) return null
    // Another worker of the same run got here first: keep its entry.
    const result = resultOf(current)
    const already = result.pieces.find(p => p.pieceId === pieceId)
    if (already) return already
    // A piece's verdict is signed from approval on: re-measuring never moves it.
    const signed = isFinished(piece.stage)
    await backfillHistory(tx, measured.map(m => m.strike.id))
    const rows: ReanalysedStrike[] = []
    let latest: { verdict: AnalysisResult['verdict'], worst: number | null, fundamentalHz: number | null } | null = null
    for (const { strike, analysis, error } of measured) {
      if (!analysis) {
        rows.push({ strikeId: strike.id, recordedAt: strike.createdAt.toISOString(), applied: false, error, change: null })
        continue
      }
      const worst = worstCents(analysis)
      const applied = !signed
      await tx.insert(strikeAnalyses).values({
        workshopId: strike.workshopId, strikeId: strike.id, engineVersion: analysis.engineVersion, analysis,
        verdict: analysis.verdict, worstCents: worst, fundamentalHz: analysis.fundamentalHz,
        applied, reason: 'reanalyze', runId: run.id, createdBy: run.requestedBy,
      })
      if (applied) {
        await tx.update(strikes).set({ engineVersion: analysis.engineVersion, analysis, verdict: analysis.verdict, worstCents: worst, fundamentalHz: analysis.fundamentalHz })
          .where(eq(strikes.id, strike.id))
        if (piece.latestStrikeId === strike.id) latest = { verdict: analysis.verdict, worst, fundamentalHz: analysis.fundamentalHz }
      }
      const change = compareResults(
        summarise(strike.engineVersion, strike.verdict, strike.worstCents, strike.analysis),
        summarise(analysis.engineVersion, analysis.verdict, worst, analysis),
      )
      rows.push({ strikeId: strike.id, recordedAt: strike.createdAt.toISOString(), applied, error: null, change })
    }
    if (latest) {
      await tx.update(pieces).set({ latestVerdict: latest.verdict, latestWorstCents: latest.worst, latestFundamentalHz: latest.fundamentalHz, updatedAt: new Date() })
        .where(eq(pieces.id, pieceId))
    }
    // On a signed piece the latest strike's new result is shown as what it would now read.
    const latestRow = rows.find(r => r.strikeId === piece.latestStrikeId)?.change
    const entry: ReanalysedPiece = {
      pieceId, position: piece.position, note: piece.note, stage: piece.stage, signed,
      oldVerdict: piece.latestVerdict, oldWorstCents: piece.latestWorstCents,
      newVerdict: latestRow ? latestRow.newVerdict : piece.latestVerdict,
      newWorstCents: latestRow ? latestRow.newWorstCents : piece.latestWorstCents,
      changed: rows.some(r => r.change?.changed), strikes: rows,
    }
    await tx.update(reanalysisRuns).set({ result: { ...result, pieces: [...result.pieces, entry] } }).where(eq(reanalysisRuns.id, run.id))
    await audit(tx, {
      workshopId: run.workshopId, actorId: run.requestedBy, action: 'piece.reanalyze', subjectType: 'piece', subjectId: pieceId,
      fromState: piece.latestVerdict, toState: entry.newVerdict, reason: signed ? 'signed: kept in history only' : null,
      details: { runId: run.id, engineVersion: ENGINE_VERSION, strikes: rows.length, applied: rows.filter(r => r.applied).length, failed: rows.filter(r => r.error).length },
    })
    return entry
  })
}

/**
 * Re-measures the run's strikes with the current engine, piece by piece: each piece's
 * new results, its strikes' and its latest-strike columns and the run's progress are
 * written in one transaction, so a run that stops part-way has half-done no piece and
 * a retry goes on with the pieces not yet done. Stages never move.
 */
export async function executeReanalysis(db: Database, storage: BlobStorage, runId: string, measure: Measure = runAnalysis) {
  const [run] = await db.update(reanalysisRuns).set({ status: 'running', startedAt: sql`coalesce(${reanalysisRuns.startedAt}, now())` })
    .where(and(eq(reanalysisRuns.id, runId), inArray(reanalysisRuns.status, ['queued', 'running']))).returning()
  if (!run) return null
  const scope = and(eq(strikes.workshopId, run.workshopId), run.pieceId ? eq(pieces.id, run.pieceId) : eq(pieces.setId, run.setId), ne(pieces.stage, 'scrapped'))
  // Ids first; each piece's strikes (with their stored results) are read when their turn comes, to keep memory bounded.
  const ids = await db.select({ pieceId: pieces.id }).from(strikes).innerJoin(pieces, eq(pieces.id, strikes.pieceId))
    .where(scope).orderBy(asc(pieces.position), asc(strikes.createdAt))
  const pieceIds = [...new Set(ids.map(r => r.pieceId))]
  const started = resultOf(run)
  const done = new Set(started.pieces.map(p => p.pieceId))
  await db.update(reanalysisRuns).set({ result: sql`${reanalysisRuns.result} || jsonb_build_object('pieceCount', ${pieceIds.length}::int, 'strikeCount', ${ids.length}::int)` })
    .where(eq(reanalysisRuns.id, runId))
  for (const pieceId of pieceIds) {
    if (done.has(pieceId)) continue
    const pieceRows = await db.select({ strike: strikes, piece: pieces, set: sets, template: templateVersions, clockOffsetPpm: calibrations.offsetPpm }).from(strikes)
      .innerJoin(pieces, eq(pieces.id, strikes.pieceId))
      .innerJoin(sets, eq(sets.id, pieces.setId))
      .innerJoin(templateVersions, eq(templateVersions.id, sql`coalesce(${strikes.templateVersionId}, ${pieces.templateVersionId})`))
      // A strike measured under an input calibration is re-measured under the same one.
      .leftJoin(calibrations, eq(calibrations.id, strikes.calibrationId))
      .where(and(eq(strikes.workshopId, run.workshopId), eq(strikes.pieceId, pieceId)))
      .orderBy(asc(strikes.createdAt))
    const measured: Measured[] = []
    for (const { strike, piece, set, template, clockOffsetPpm } of pieceRows) {
      const bytes = await storage.get(strike.audioKey)
      if (!bytes) {
        measured.push({ strike, analysis: null, error: 'The recording of this strike is missing from storage.' })
        continue
      }
      try {
        // A full pool is busy with strikes people wait for: this run waits its turn rather than failing the strike.
        const analysis = await measureWhenFree(() => measure(bytes, {
          note: piece.note, targetHz: piece.targetHz, referenceHz: set.referenceHz, temperatureC: strike.temperatureC ?? undefined,
          clockOffsetPpm: clockOffsetPpm ?? undefined,
          template: {
            partials: template.partials, searchWindowCents: template.searchWindowCents,
            referenceTemperatureC: template.referenceTemperatureC, temperatureCoefficientCentsPerC: template.temperatureCoefficientCentsPerC,
          },
        }))
        measured.push({ strike, analysis, error: null })
      }
      catch (error) {
        measured.push({ strike, analysis: null, error: plainError(error) })
      }
      // Let requests on this process through between strikes.
      await nextTurn()
    }
    const entry = await commitPiece(db, run, pieceId, measured)
    if (!entry) return null
  }
  return finishRun(db, run)
}

async function finishRun(db: Database, run: ReanalysisRun) {
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(reanalysisRuns).where(eq(reanalysisRuns.id, run.id)).for('update')
    if (!current || current.status !== 'running') return null
    const result = { ...resultOf(current), done: true }
    const [finished] = await tx.update(reanalysisRuns).set({ status: 'done', engineVersion: ENGINE_VERSION, finishedAt: new Date(), result })
      .where(eq(reanalysisRuns.id, run.id)).returning()
    const strikeRows = result.pieces.flatMap(p => p.strikes)
    await audit(tx, {
      workshopId: run.workshopId, actorId: run.requestedBy, action: 'reanalysis.done', subjectType: run.scope, subjectId: run.pieceId ?? run.setId,
      fromState: 'running', toState: 'done',
      details: { runId: run.id, engineVersion: ENGINE_VERSION, pieces: result.pieces.length, strikes: strikeRows.length, changed: strikeRows.filter(s => s.change?.changed).length, failed: strikeRows.filter(s => s.error).length },
    })
    return finished!
  })
}

/** Marks a run failed with a plain sentence (the job gave up, or it stopped and was found stale). */
export async function failReanalysis(db: Executor, runId: string, message: string) {
  const [run] = await db.update(reanalysisRuns).set({ status: 'failed', error: message, finishedAt: new Date() })
    .where(and(eq(reanalysisRuns.id, runId), inArray(reanalysisRuns.status, ['queued', 'running']))).returning()
  if (run) {
    await audit(db, { workshopId: run.workshopId, actorId: run.requestedBy, action: 'reanalysis.failed', subjectType: run.scope, subjectId: run.pieceId ?? run.setId, toState: 'failed', reason: message, details: { runId } })
  }
  return run ?? null
}
