import { and, asc, eq, inArray } from 'drizzle-orm'
import { pieces, strikes, templateVersions } from '../database/schema'
import type { Executor } from '../database/client'
import { toCsv, type CsvValue } from '../../shared/format/csv'
import { parseStoredAnalysis } from '../../shared/schemas/analysis'
import type { MeasuredPartial, PartialMatch } from '../../shared/analysis/types'
import { getSet } from './sets'

/** The columns of a set's export, units in the names (Hz, cents, dB, dB/s, s, °C; times in UTC, ISO 8601). */
export const SET_EXPORT_HEADER = [
  'set_serial', 'position', 'note', 'stage', 'partial', 'ratio', 'required', 'target_hz', 'measured_hz',
  'deviation_cents', 'raw_deviation_cents', 'tolerance_cents', 'result', 'amplitude_db', 'decay_db_per_s', 't60_s',
  'temperature_c', 'strike', 'engine_version', 'measured_at_utc',
] as const

const round = (value: number | null | undefined, digits: number) =>
  value === null || value === undefined || !Number.isFinite(value) ? null : Number(value.toFixed(digits))

/** The measured partial a match was made from (the nearest in frequency). */
function partialOf(match: PartialMatch, partials: MeasuredPartial[]) {
  if (match.measuredHz === null) return undefined
  let best: MeasuredPartial | undefined
  for (const p of partials) if (!best || Math.abs(p.frequencyHz - match.measuredHz) < Math.abs(best.frequencyHz - match.measuredHz)) best = p
  return best
}

const resultOf = (m: PartialMatch) => (m.missing ? 'missing' : m.within ? 'within' : 'outside')

/**
 * One row per piece and tuned partial: the approved strike of a piece when it has one,
 * else its latest; a piece not struck yet gets its template's partials with empty measurements.
 */
export async function exportSetCsv(db: Executor, workshopId: string, setId: string) {
  const set = await getSet(db, workshopId, setId)
  const rows = await db.select({ piece: pieces, partials: templateVersions.partials }).from(pieces)
    .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
    .where(and(eq(pieces.setId, setId), eq(pieces.workshopId, workshopId))).orderBy(asc(pieces.position))
  const strikeIds = rows.map(r => r.piece.approvedStrikeId ?? r.piece.latestStrikeId).filter((id): id is string => Boolean(id))
  const strikeRows = strikeIds.length
    ? await db.select().from(strikes).where(and(eq(strikes.workshopId, workshopId), inArray(strikes.id, strikeIds)))
    : []
  const byId = new Map(strikeRows.map(s => [s.id, s]))
  const out: CsvValue[][] = []
  for (const { piece, partials } of rows) {
    const strikeId = piece.approvedStrikeId ?? piece.latestStrikeId
    const strike = strikeId ? byId.get(strikeId) : undefined
    const lead: CsvValue[] = [set.serial, piece.position, piece.note, piece.stage]
    if (!strike) {
      for (const t of partials) out.push([...lead, t.label, t.ratio, t.required ? 'yes' : 'no', round(piece.targetHz * t.ratio, 3), null, null, null, t.toleranceCents, 'not measured', null, null, null, null, null, null, null])
      continue
    }
    const analysis = parseStoredAnalysis(strike.analysis)
    const which = strike.id === piece.approvedStrikeId ? 'approved' : 'latest'
    for (const m of analysis.matches ?? []) {
      const p = partialOf(m, analysis.partials)
      out.push([
        ...lead, m.label, m.ratio, m.required ? 'yes' : 'no', round(m.targetHz, 3), round(m.measuredHz, 3),
        round(m.cents, 1), round(m.rawCents, 1), m.toleranceCents, resultOf(m), round(p?.amplitudeDb, 1), round(p?.decayDbPerS, 2), round(p?.t60S, 2),
        round(strike.temperatureC, 1), which, strike.engineVersion, strike.createdAt.toISOString(),
      ])
    }
  }
  const safeSerial = set.serial.replace(/[^\w.-]+/g, '_').slice(0, 60) || 'set'
  return { filename: `tonewright-${safeSerial}-results.csv`, csv: toCsv(SET_EXPORT_HEADER, out) }
}
