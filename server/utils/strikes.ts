import { randomUUID } from 'node:crypto'
import { and, eq, sql } from 'drizzle-orm'
import { pieces, sets, strikeAnalyses, strikes, templateVersions } from '../database/schema'
import type { Database } from '../database/client'
import type { AnalysisResult } from '../../shared/analysis/types'
import { STAGE_LABELS, STRIKEABLE_STAGES } from '../../shared/records/stages'
import type { Member } from './auth'
import { runAnalysis } from './analysis'
import { audit } from './audit'
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

const EXTENSIONS: Record<string, string> = { wav: 'wav', flac: 'flac', mp3: 'mp3', ogg: 'ogg', oga: 'ogg', opus: 'ogg' }

function extensionOf(name: string) {
  const ext = name.split('.').pop()?.toLowerCase() ?? ''
  return EXTENSIONS[ext] ?? 'bin'
}

/**
 * Measures an uploaded strike against the piece's target and template version,
 * stores the audio and the engine's result, and updates the piece's latest-strike
 * columns, all or nothing: a file the engine refuses leaves no trace.
 */
export async function recordStrike(
  db: Database,
  storage: BlobStorage,
  member: Member,
  pieceId: string,
  file: UploadedFile,
  conditions: { temperatureC?: number, humidityPct?: number },
) {
  const [row] = await db.select({ piece: pieces, set: sets, template: templateVersions }).from(pieces)
    .innerJoin(sets, eq(sets.id, pieces.setId))
    .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
    .where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, member.workshopId)))
  if (!row) fail(404, 'No such piece in this workshop.')
  const { piece, set, template } = row
  if (!STRIKEABLE_STAGES.includes(piece.stage)) {
    fail(409, `This piece is ${STAGE_LABELS[piece.stage].toLowerCase()}; ${piece.stage === 'approved' ? 'a supervisor must reopen it before it is struck again' : 'it takes no more strikes'}.`)
  }
  if (member.role === 'benchmaker' && piece.assigneeId && piece.assigneeId !== member.userId) fail(403, 'This piece is assigned to someone else.')

  const analysis = await runAnalysis(file.bytes, {
    note: piece.note,
    targetHz: piece.targetHz,
    referenceHz: set.referenceHz,
    temperatureC: conditions.temperatureC,
    template: {
      partials: template.partials,
      searchWindowCents: template.searchWindowCents,
      referenceTemperatureC: template.referenceTemperatureC,
      temperatureCoefficientCentsPerC: template.temperatureCoefficientCentsPerC,
    },
  })

  const strikeId = randomUUID()
  const audioKey = `workshops/${member.workshopId}/strikes/${pieceId}/${strikeId}.${extensionOf(file.filename)}`
  await storage.put(audioKey, file.bytes, file.type || 'application/octet-stream')
  try {
    return await db.transaction(async (tx) => {
      // Lock the piece: its stage may have moved while the engine ran.
      const [current] = await tx.select({ stage: pieces.stage }).from(pieces).where(eq(pieces.id, pieceId)).for('update')
      if (!current || !STRIKEABLE_STAGES.includes(current.stage)) fail(409, 'The piece changed stage while the strike was measured; strike it again.')
      const verdict = analysis.verdict
      const worst = worstCents(analysis)
      const [strike] = await tx.insert(strikes).values({
        id: strikeId, workshopId: member.workshopId, pieceId, userId: member.userId, stage: current.stage,
        temperatureC: conditions.temperatureC ?? null, humidityPct: conditions.humidityPct ?? null,
        audioKey, audioBytes: file.bytes.byteLength, audioType: file.type || 'application/octet-stream', audioName: file.filename.slice(0, 200),
        engineVersion: analysis.engineVersion, analysis, templateVersionId: template.id,
        fundamentalHz: analysis.fundamentalHz, worstCents: worst, verdict,
      }).returning()
      // The first entry of the strike's result history.
      await tx.insert(strikeAnalyses).values({
        workshopId: member.workshopId, strikeId, engineVersion: analysis.engineVersion, analysis, verdict, worstCents: worst,
        fundamentalHz: analysis.fundamentalHz, applied: true, reason: 'recorded', createdBy: member.userId, createdAt: strike!.createdAt,
      })
      // A blank or returned piece is being tuned as soon as it is struck; a strike while
      // roughing or in review leaves the stage alone.
      const stage = current.stage === 'rework' || current.stage === 'blank' ? 'tuning' : current.stage
      await tx.update(pieces).set({
        strikeCount: sql`${pieces.strikeCount} + 1`, latestStrikeId: strikeId, latestVerdict: verdict,
        latestWorstCents: worst, latestFundamentalHz: analysis.fundamentalHz, latestStrikeAt: strike!.createdAt,
        stage, assigneeId: piece.assigneeId ?? (member.role === 'benchmaker' ? member.userId : null), updatedAt: new Date(),
      }).where(eq(pieces.id, pieceId))
      if (stage !== current.stage) {
        await audit(tx, { workshopId: member.workshopId, actorId: member.userId, action: 'piece.stage', subjectType: 'piece', subjectId: pieceId, fromState: current.stage, toState: stage, reason: 'struck' })
      }
      return { ...strike!, analysis }
    })
  }
  catch (error) {
    await storage.delete(audioKey).catch(() => {})
    throw error
  }
}
