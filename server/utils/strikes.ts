import { randomUUID } from 'node:crypto'
import { and, eq, getTableColumns, sql } from 'drizzle-orm'
import { pieces, sets, strikeAnalyses, strikes, templateVersions } from '../database/schema'
import type { Database } from '../database/client'
import { storedAudioExtension } from '../../shared/analysis/audioFormats'
import type { AnalysisResult } from '../../shared/analysis/types'
import { assigneeAfter, assigneeProblem, isStrikeable, STAGE_LABELS, stageAfterStrike, type PieceStage } from '../../shared/records/stages'
import type { Member } from './auth'
import { measureStrike } from './analysis'
import { audit } from './audit'
import { appliedCalibration, calibrationInUse } from './calibration-views'
import { fail } from './http-errors'
import type { UploadedFile } from './multipart'
import type { BlobStorage } from './storage'

/** The required partial furthest from its target, signed (null when none was measured). */
export function worstCents(result: AnalysisResult): number | null {
  let worst: number | null = null
  for (const m of result.matches ?? []) {
    if (!m.required || m.cents === null) continue
    if (worst === null || Math.abs(m.cents) > Math.abs(worst)) worst = m.cents
  }
  return worst
}

/** Where an upload waits until its row commits; the sweep clears what never did. */
export const PENDING_STRIKE_AUDIO = 'pending/strikes/'

export function pendingAudioKey(workshopId: string, strikeId: string, extension: string) {
  return `${PENDING_STRIKE_AUDIO}${workshopId}/${strikeId}.${extension}`
}

/** A strike's columns but its result, which the caller already holds. */
const { analysis: _analysis, ...STRIKE_COLUMNS } = getTableColumns(strikes)

/** PostgreSQL's "lock not available" (lock_timeout) and "serialization failure". */
const BUSY_CODES = new Set(['55P03', '40001'])

/**
 * Measures an uploaded strike against the piece's target and template version,
 * stores the audio and the engine's result, and updates the piece's latest-strike
 * columns, all or nothing: a file the engine refuses leaves no trace. The audio is
 * written under a pending key and promoted after the row commits, so a crash or an
 * aborted transaction leaves at most a pending object, which the sweep
 * (strike-uploads.ts) removes. Under the piece's lock the row is read again and only
 * the columns a strike owns are written: a change made while the engine ran (stage,
 * assignee) is kept, never overwritten from the first read. A `calibration-id` field names
 * the input calibration the frequencies are corrected with (404 unless the workshop's,
 * before the engine runs); the strike keeps its id.
 */
export async function recordStrike(
  db: Database,
  storage: BlobStorage,
  member: Member,
  pieceId: string,
  file: UploadedFile,
  conditions: { temperatureC?: number, humidityPct?: number },
  fields: Record<string, string> = {},
) {
  const [row] = await db.select({ piece: pieces, set: sets, template: templateVersions }).from(pieces)
    .innerJoin(sets, eq(sets.id, pieces.setId))
    .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
    .where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, member.workshopId)))
    .prepare('strike_piece').execute()
  if (!row) fail(404, 'No such piece in this workshop.')
  const { piece, set, template } = row
  checkStrikeable(piece.stage)
  checkAssignee(member, piece.assigneeId)
  const calibration = await calibrationInUse(db, member.workshopId, fields)

  const { result: analysis, json: analysisJson } = await measureStrike(file.bytes, {
    note: piece.note,
    targetHz: piece.targetHz,
    referenceHz: set.referenceHz,
    temperatureC: conditions.temperatureC,
    clockOffsetPpm: calibration?.offsetPpm,
    template: {
      partials: template.partials,
      searchWindowCents: template.searchWindowCents,
      referenceTemperatureC: template.referenceTemperatureC,
      temperatureCoefficientCentsPerC: template.temperatureCoefficientCentsPerC,
    },
  })

  const strikeId = randomUUID()
  const extension = storedAudioExtension(file.filename)
  const audioKey = `workshops/${member.workshopId}/strikes/${pieceId}/${strikeId}.${extension}`
  const pendingKey = pendingAudioKey(member.workshopId, strikeId, extension)
  await storage.put(pendingKey, file.bytes, file.type || 'application/octet-stream')
  let saved
  try {
    saved = await db.transaction(async (tx) => {
      // A strike never waits long for a busy piece; the pending upload must not outlive the sweep's age.
      await tx.execute(sql`set local lock_timeout = '20s'`)
      // Lock the piece and read it again: its stage or assignee may have changed while the engine ran.
      // Named statements (here and below): parsed once per connection, one round trip each after that.
      const [current] = await tx.select({ stage: pieces.stage, assigneeId: pieces.assigneeId }).from(pieces).where(eq(pieces.id, pieceId)).for('update')
        .prepare('strike_lock_piece').execute()
      if (!current || !isStrikeable(current.stage)) fail(409, 'The piece changed stage while the strike was measured; strike it again.')
      checkAssignee(member, current.assigneeId)
      const verdict = analysis.verdict
      const worst = worstCents(analysis)
      // The worker's JSON text goes to both rows as it is; the stored result is not read back.
      const stored = sql`${analysisJson}::jsonb`
      const [strike] = await tx.insert(strikes).values({
        id: strikeId, workshopId: member.workshopId, pieceId, userId: member.userId, stage: current.stage,
        temperatureC: conditions.temperatureC ?? null, humidityPct: conditions.humidityPct ?? null,
        audioKey, audioBytes: file.bytes.byteLength, audioType: file.type || 'application/octet-stream', audioName: file.filename.slice(0, 200),
        engineVersion: analysis.engineVersion, analysis: stored, templateVersionId: template.id,
        fundamentalHz: analysis.fundamentalHz, worstCents: worst, verdict, calibrationId: calibration?.id ?? null,
      }).returning(STRIKE_COLUMNS).prepare('strike_insert').execute()
      // The first entry of the strike's result history.
      await tx.insert(strikeAnalyses).values({
        workshopId: member.workshopId, strikeId, engineVersion: analysis.engineVersion, analysis: stored, verdict, worstCents: worst,
        fundamentalHz: analysis.fundamentalHz, applied: true, reason: 'recorded', createdBy: member.userId, createdAt: strike!.createdAt,
      }).prepare('strike_analysis_insert').execute()
      const stage = stageAfterStrike(current.stage)
      const assigneeId = assigneeAfter(member.role, member.userId, current.assigneeId)
      await tx.update(pieces).set({
        strikeCount: sql`${pieces.strikeCount} + 1`, latestStrikeId: strikeId, latestVerdict: verdict,
        latestWorstCents: worst, latestFundamentalHz: analysis.fundamentalHz, latestStrikeAt: strike!.createdAt,
        stage, assigneeId, updatedAt: new Date(),
      }).where(eq(pieces.id, pieceId)).prepare('strike_piece_update').execute()
      if (stage !== current.stage) {
        await audit(tx, { workshopId: member.workshopId, actorId: member.userId, action: 'piece.stage', subjectType: 'piece', subjectId: pieceId, fromState: current.stage, toState: stage, reason: 'struck' })
      }
      return { ...strike!, analysis, calibration: calibration && appliedCalibration(calibration), calibrationExpired: calibration?.expired ?? false }
    })
  }
  catch (error) {
    await storage.delete(pendingKey).catch(() => {})
    if (BUSY_CODES.has(postgresCode(error) ?? '')) fail(409, 'Someone else is changing this piece right now; strike it again.')
    throw error
  }
  // Committed: promote the audio. Should this process die first, the sweep promotes it.
  await storage.move(pendingKey, audioKey)
  return saved
}

function checkStrikeable(stage: PieceStage) {
  if (!isStrikeable(stage)) {
    fail(409, `This piece is ${STAGE_LABELS[stage].toLowerCase()}; ${stage === 'approved' ? 'a supervisor must reopen it before it is struck again' : 'it takes no more strikes'}.`)
  }
}

function checkAssignee(member: Member, assigneeId: string | null) {
  const problem = assigneeProblem(member.role, member.userId, assigneeId)
  if (problem) fail(403, `This piece ${problem}`)
}

function postgresCode(error: unknown): string | undefined {
  for (let e = error as { code?: unknown, cause?: unknown } | undefined, i = 0; e && i < 4; e = e.cause as typeof e, i++) {
    if (typeof e.code === 'string') return e.code
  }
  return undefined
}
