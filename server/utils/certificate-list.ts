import { and, desc, eq, inArray } from 'drizzle-orm'
import { certificates, mailMessages, sets } from '../database/schema'
import type { Executor } from '../database/client'

/** The workshop's certificates, newest first, with their set and latest mail status. */
export async function listCertificates(db: Executor, workshopId: string, setId?: string) {
  const rows = await db.select({
    id: certificates.id, number: certificates.number, code: certificates.code, status: certificates.status,
    setId: certificates.setId, setName: sets.name, setSerial: sets.serial, model: sets.model,
    buyerName: sets.buyerName, buyerOrganisation: sets.buyerOrganisation, buyerEmail: sets.buyerEmail,
    signerName: certificates.signerName, signedAt: certificates.signedAt, contentHash: certificates.contentHash,
    supersedesId: certificates.supersedesId, supersededById: certificates.supersededById,
    revokedReason: certificates.revokedReason, revokedAt: certificates.revokedAt, pdfStatus: certificates.pdfStatus,
    reissueReason: certificates.reissueReason,
  }).from(certificates).innerJoin(sets, eq(sets.id, certificates.setId))
    .where(setId ? and(eq(certificates.workshopId, workshopId), eq(certificates.setId, setId)) : eq(certificates.workshopId, workshopId))
    .orderBy(desc(certificates.signedAt))
    .limit(500)
  const ids = rows.map(r => r.id)
  const mails = ids.length
    ? await db.select({ certificateId: mailMessages.certificateId, id: mailMessages.id, to: mailMessages.to, status: mailMessages.status, attempts: mailMessages.attempts, lastError: mailMessages.lastError, createdAt: mailMessages.createdAt, sentAt: mailMessages.sentAt })
        .from(mailMessages).where(and(eq(mailMessages.workshopId, workshopId), inArray(mailMessages.certificateId, ids))).orderBy(desc(mailMessages.createdAt))
    : []
  return rows.map(r => ({ ...r, mails: mails.filter(m => m.certificateId === r.id) }))
}
