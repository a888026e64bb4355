import { and, count, desc, eq, inArray, or, type SQL } from 'drizzle-orm'
import { auditEvents, certificates, pieces, sets, users } from '../database/schema'
import type { Executor } from '../database/client'
import { auditSentence } from '../../shared/records/auditWords'
import type { TimelineQuery } from '../../shared/schemas/timeline'
import { fail } from './http-errors'

/** One page of audit events matching `subjects`, newest first, each with who did it and a plain sentence. */
async function timelinePage(db: Executor, workshopId: string, subjects: SQL, query: TimelineQuery) {
  const where = and(eq(auditEvents.workshopId, workshopId), subjects)
  const [total] = await db.select({ n: count() }).from(auditEvents).where(where)
  const rows = await db.select({
    id: auditEvents.id, at: auditEvents.at, action: auditEvents.action, subjectType: auditEvents.subjectType,
    fromState: auditEvents.fromState, toState: auditEvents.toState, reason: auditEvents.reason, details: auditEvents.details,
    actorName: users.name,
  }).from(auditEvents).leftJoin(users, eq(users.id, auditEvents.actorId)).where(where)
    .orderBy(desc(auditEvents.at), desc(auditEvents.id))
    .limit(query.pageSize).offset((query.page - 1) * query.pageSize)
  return {
    page: query.page, pageSize: query.pageSize, total: total?.n ?? 0,
    items: rows.map(({ details, ...r }) => ({ ...r, who: r.actorName ?? 'Tonewright', what: auditSentence({ ...r, details }) })),
  }
}

/** The audit trail of a set: the set itself and its certificates. */
export async function setTimeline(db: Executor, workshopId: string, setId: string, query: TimelineQuery) {
  const [set] = await db.select({ id: sets.id }).from(sets).where(and(eq(sets.id, setId), eq(sets.workshopId, workshopId)))
  if (!set) fail(404, 'No such set in this workshop.')
  const certificateIds = db.select({ id: certificates.id }).from(certificates).where(and(eq(certificates.setId, setId), eq(certificates.workshopId, workshopId)))
  return timelinePage(db, workshopId, or(eq(auditEvents.subjectId, setId), inArray(auditEvents.subjectId, certificateIds))!, query)
}

/** The certificate events that change a piece's standing (its stage moves with them). */
const PIECE_CERTIFICATE_ACTIONS = ['certificate.sign', 'certificate.reissue', 'certificate.revoke']

/** The audit trail of a piece, with the signing, re-issue and revocation of its set's certificates. */
export async function pieceTimeline(db: Executor, workshopId: string, pieceId: string, query: TimelineQuery) {
  const [piece] = await db.select({ id: pieces.id, setId: pieces.setId }).from(pieces).where(and(eq(pieces.id, pieceId), eq(pieces.workshopId, workshopId)))
  if (!piece) fail(404, 'No such piece in this workshop.')
  const certificateIds = db.select({ id: certificates.id }).from(certificates).where(and(eq(certificates.setId, piece.setId), eq(certificates.workshopId, workshopId)))
  return timelinePage(db, workshopId, or(
    eq(auditEvents.subjectId, pieceId),
    and(inArray(auditEvents.subjectId, certificateIds), inArray(auditEvents.action, PIECE_CERTIFICATE_ACTIONS)),
  )!, query)
}
