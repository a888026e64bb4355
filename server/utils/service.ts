import { and, asc, eq, isNull } from 'drizzle-orm'
import { auditEvents, certificates, pieces, serviceRecords, sets } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { ServiceBooking } from '../../shared/schemas/service'
import { SERVICE_KIND_LABELS, type CertificateStatus, type SetHistoryKind } from '../../shared/records/lists'
import type { Member } from './auth'
import { audit } from './audit'
import { conflictOnDuplicate, fail } from './http-errors'

const ALREADY_BOOKED = 'This set is already booked in for service.'

/**
 * Books a shipped set in for service, in one transaction under the set's row lock: the
 * service record, every shipped piece back to tuning (each audited), and the set no
 * longer marked shipped. A second booking waits for the lock and finds the set in service
 * (409); the one-open-visit index is the last word.
 */
export function bookService(db: Database, member: Member, setId: string, input: ServiceBooking) {
  return conflictOnDuplicate(() => db.transaction(async (tx) => {
    const [set] = await tx.select().from(sets).where(and(eq(sets.id, setId), eq(sets.workshopId, member.workshopId))).for('update')
    if (!set) fail(404, 'No such set in this workshop.')
    const [open] = await tx.select({ id: serviceRecords.id }).from(serviceRecords)
      .where(and(eq(serviceRecords.setId, setId), eq(serviceRecords.workshopId, member.workshopId), isNull(serviceRecords.closedAt)))
    if (open) fail(409, ALREADY_BOOKED)
    if (!set.shippedAt) fail(409, 'Only a shipped set can be booked in for service.')
    const [valid] = await tx.select({ id: certificates.id, number: certificates.number }).from(certificates)
      .where(and(eq(certificates.setId, setId), eq(certificates.status, 'valid')))
    const [record] = await tx.insert(serviceRecords).values({
      workshopId: member.workshopId, setId, kind: input.kind, receivedOn: input.receivedOn, reason: input.reason,
      conditions: input.conditions, previousCertificateId: valid?.id ?? null, bookedBy: member.userId,
    }).returning()
    const now = new Date()
    const moved = await tx.update(pieces).set({ stage: 'tuning', approvedStrikeId: null, approvedAt: null, updatedAt: now })
      .where(and(eq(pieces.setId, setId), eq(pieces.stage, 'shipped'))).returning({ id: pieces.id })
    for (const p of moved) {
      await audit(tx, {
        workshopId: member.workshopId, actorId: member.userId, action: 'piece.service', subjectType: 'piece', subjectId: p.id,
        fromState: 'shipped', toState: 'tuning', reason: input.reason, details: { serviceId: record!.id },
      })
    }
    await tx.update(sets).set({ shippedAt: null }).where(eq(sets.id, setId))
    await audit(tx, {
      workshopId: member.workshopId, actorId: member.userId, action: 'set.service', subjectType: 'set', subjectId: setId,
      fromState: 'shipped', toState: 'service', reason: input.reason,
      details: { serviceId: record!.id, kind: input.kind, receivedOn: input.receivedOn, pieces: moved.length, certificate: valid?.number ?? null },
    })
    return { ...record!, pieceCount: moved.length }
  }), ALREADY_BOOKED, 'service_records_set_open_key')
}

/** The set's open service record, if any (read inside the signing transaction, which holds the set lock). */
export async function openService(tx: Executor, setId: string) {
  const [open] = await tx.select().from(serviceRecords)
    .where(and(eq(serviceRecords.setId, setId), isNull(serviceRecords.closedAt)))
  return open ?? null
}

/** The re-issue reason a certificate signed at the end of a service gives. */
export function serviceReissueReason(record: { kind: keyof typeof SERVICE_KIND_LABELS, receivedOn: string, reason: string }) {
  return `${SERVICE_KIND_LABELS[record.kind]} after service booked ${record.receivedOn}: ${record.reason}`
}

/** Closes the set's open service record with the certificate that ends it (inside the signing transaction). */
export async function closeService(tx: Executor, member: Member, setId: string, certificateId: string) {
  const open = await openService(tx, setId)
  if (!open) return
  await tx.update(serviceRecords).set({ certificateId, closedAt: new Date() }).where(eq(serviceRecords.id, open.id))
  await audit(tx, {
    workshopId: member.workshopId, actorId: member.userId, action: 'service.close', subjectType: 'set', subjectId: setId,
    fromState: 'service', toState: 'certified', details: { serviceId: open.id, certificateId },
  })
}

interface HistoryEvent {
  at: Date
  kind: SetHistoryKind
  text: string
  reason: string | null
  certificate: { number: string, code: string, status: CertificateStatus } | null
}

/** A set's whole life in time order: made, certified, shipped, booked in, re-certified, revoked. */
export async function setHistory(db: Executor, workshopId: string, setId: string) {
  const [set] = await db.select().from(sets).where(and(eq(sets.id, setId), eq(sets.workshopId, workshopId)))
  if (!set) fail(404, 'No such set in this workshop.')
  const certs = await db.select().from(certificates).where(and(eq(certificates.setId, setId), eq(certificates.workshopId, workshopId))).orderBy(asc(certificates.signedAt))
  const shipments = await db.select({ at: auditEvents.at }).from(auditEvents)
    .where(and(eq(auditEvents.workshopId, workshopId), eq(auditEvents.subjectId, setId), eq(auditEvents.action, 'set.ship')))
  const services = await db.select().from(serviceRecords).where(and(eq(serviceRecords.setId, setId), eq(serviceRecords.workshopId, workshopId))).orderBy(asc(serviceRecords.createdAt))
  const closedBy = new Map(services.filter(s => s.certificateId).map(s => [s.certificateId!, s]))
  const badge = (c: typeof certs[number]) => ({ number: c.number, code: c.code, status: c.status })
  const events: HistoryEvent[] = [{ at: set.createdAt, kind: 'made', text: `Entered as serial ${set.serial}.`, reason: null, certificate: null }]
  for (const c of certs) {
    const service = closedBy.get(c.id)
    const previous = certs.find(p => p.id === c.supersedesId)
    events.push({
      at: c.signedAt, kind: previous ? 'recertified' : 'certified',
      text: `Certificate ${c.number} signed by ${c.signerName}${previous ? `, superseding ${previous.number}` : ''}${service ? ' at the end of the service' : ''}.`,
      reason: c.reissueReason, certificate: badge(c),
    })
    if (c.revokedAt) events.push({ at: c.revokedAt, kind: 'revoked', text: `Certificate ${c.number} revoked.`, reason: c.revokedReason, certificate: badge(c) })
  }
  for (const s of shipments) events.push({ at: s.at, kind: 'shipped', text: 'Marked shipped.', reason: null, certificate: null })
  for (const s of services) {
    const came = certs.find(c => c.id === s.previousCertificateId)
    events.push({
      at: s.createdAt, kind: 'serviced',
      text: `Booked in for ${SERVICE_KIND_LABELS[s.kind].toLowerCase()}, received ${s.receivedOn}${came ? ` with certificate ${came.number}` : ''}${s.conditions ? `. Conditions: ${s.conditions}` : ''}.`,
      reason: s.reason, certificate: null,
    })
  }
  events.sort((a, b) => a.at.getTime() - b.at.getTime())
  const open = services.find(s => !s.closedAt) ?? null
  return { events, services, openService: open }
}
