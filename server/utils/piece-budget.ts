import { and, asc, desc, eq, lte } from 'drizzle-orm'
import { calibrations, pieces, strikes, templateVersions, workshops, type Strike, type TemplateVersion } from '../database/schema'
import type { Executor } from '../database/client'
import { parseStoredAnalysis } from '../../shared/schemas/analysis'
import { matchUncertaintyCents } from '../../shared/certificates/uncertaintyText'
import { clockDriftPpm } from '../../shared/uncertainty/clockDriftPpm'
import type { ClockEvidence, PieceBudget } from '../../shared/uncertainty/evidence'
import { pieceBudget } from '../../shared/uncertainty/pieceBudget'
import { fail } from './http-errors'
import { finalStateStrikes } from './final-state'

const MS_PER_DAY = 86_400_000

/** The input calibration a strike was measured under, with expiry and drift from the device's history up to the strike. */
export async function clockEvidence(db: Executor, workshopId: string, strike: Pick<Strike, 'calibrationId' | 'createdAt'>, validDays: number): Promise<ClockEvidence> {
  if (!strike.calibrationId) return { state: 'none' }
  const [cal] = await db.select().from(calibrations).where(and(eq(calibrations.id, strike.calibrationId), eq(calibrations.workshopId, workshopId)))
  if (!cal) return { state: 'none' }
  const history = await db.select({ createdAt: calibrations.createdAt, offsetPpm: calibrations.offsetPpm }).from(calibrations)
    .where(and(eq(calibrations.workshopId, workshopId), eq(calibrations.device, cal.device), lte(calibrations.createdAt, strike.createdAt)))
    .orderBy(asc(calibrations.createdAt))
  const strikeMs = strike.createdAt.getTime()
  const calibratedMs = cal.createdAt.getTime()
  return {
    state: 'calibrated', device: cal.device, calibratedAt: cal.createdAt.toISOString(),
    offsetPpm: cal.offsetPpm, uncertaintyPpm: cal.uncertaintyPpm, referenceUncertaintyPpm: cal.referenceUncertaintyPpm,
    expired: strikeMs > calibratedMs + validDays * MS_PER_DAY,
    driftPpm: clockDriftPpm(history.map(h => ({ atMs: h.createdAt.getTime(), offsetPpm: h.offsetPpm })), calibratedMs, Math.max(strikeMs, calibratedMs)),
  }
}

/** The budget of a piece at its reference strike, read inside the caller's transaction or on its own. */
export async function budgetAtStrike(db: Executor, workshopId: string, pieceId: string, reference: Strike, template: TemplateVersion, validDays: number): Promise<PieceBudget> {
  const finalState = await finalStateStrikes(db, workshopId, pieceId, reference.id)
  const analysis = parseStoredAnalysis(reference.analysis)
  const matches = (analysis.matches ?? []).map(m => ({
    label: m.label, cents: m.cents, toleranceCents: m.toleranceCents, required: m.required, missing: m.missing,
    uncertaintyCents: matchUncertaintyCents(m, analysis.partials),
  }))
  return pieceBudget({
    matches,
    finalState: finalState.map(s => (parseStoredAnalysis(s.analysis).matches ?? []).map(m => ({ label: m.label, cents: m.cents }))),
    clock: await clockEvidence(db, workshopId, reference, validDays),
    temperatureRecorded: reference.temperatureC !== null,
    temperatureCoefficientCentsPerK: template.temperatureCoefficientCentsPerC,
    rule: template.decisionRule,
  })
}

/** A piece's budget at its approved strike, else its latest; null before its first strike. */
export async function getPieceBudget(db: Executor, workshopId: string, pieceId: string): Promise<{ strikeId: string, budget: PieceBudget } | null> {
  const [row] = await db.select({ piece: pieces, template: templateVersions, validDays: workshops.calibrationValidDays }).from(pieces)
    .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
    .innerJoin(workshops, eq(workshops.id, pieces.workshopId))
    .where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, workshopId)))
  if (!row) fail(404, 'No such piece in this workshop.')
  const byId = row.piece.approvedStrikeId ? eq(strikes.id, row.piece.approvedStrikeId) : eq(strikes.pieceId, pieceId)
  const [reference] = await db.select().from(strikes).where(and(byId, eq(strikes.workshopId, workshopId))).orderBy(desc(strikes.createdAt)).limit(1)
  if (!reference) return null
  return { strikeId: reference.id, budget: await budgetAtStrike(db, workshopId, pieceId, reference, row.template, row.validDays) }
}
