import { and, eq } from 'drizzle-orm'
import { certificates, pieces, type Certificate } from '../database/schema'
import type { Database, Executor, Transactor } from '../database/client'
import { parseCertificateContent } from '../../shared/schemas/certificateContent'
import type { Member } from './auth'
import { audit } from './audit'
import { freezeCertificate, type Reissue } from './certificate-freeze'
import type { Paper } from './certificate-pdf'
import { PDF_PENDING } from './certificate-pdf-job'
import { renderPdfOffThread } from './certificate-pdf-pool'
import { storeCertificate } from './certificate-store'
import { fail } from './http-errors'
import { closeService, openService, serviceReissueReason } from './service'
import { certificateMail, queueMail } from './mail'
import type { BlobStorage } from './storage'

/** Postgres' unique-violation code, and the index that allows one valid certificate per set. */
const UNIQUE_VIOLATION = '23505'
const ONE_VALID_PER_SET = 'certificates_set_valid_key'

function isOneValidViolation(error: unknown) {
  const e = error as { code?: string, constraint_name?: string, cause?: { code?: string, constraint_name?: string } }
  const pg = e?.code ? e : e?.cause
  return pg?.code === UNIQUE_VIOLATION && pg.constraint_name === ONE_VALID_PER_SET
}

/**
 * Signs the certificate of a set whose every live piece is approved, in one
 * transaction: freeze (read, check and build the content), then store (the rows,
 * pieces to certified, the PDF queued). The render step is the PDF job
 * (`renderPendingPdf`); `pdf_status` is `pending` until it has stored the PDF.
 * A set with a valid certificate is refused (409): replacing it is the separate,
 * explicit re-issue with a reason. Two signings racing meet at the set row lock,
 * and the one-valid-per-set index is the last word.
 */
export async function signCertificate(db: Transactor, member: Member, setId: string, siteUrl: string) {
  return issue(db, member, setId, siteUrl, null)
}

/** Re-issues a valid certificate: a new number from the set's current records supersedes it. */
export async function reissueCertificate(db: Database, member: Member, id: string, reason: string, siteUrl: string) {
  const cert = await findCertificate(db, member.workshopId, id)
  return issue(db, member, cert.setId, siteUrl, { id, reason })
}

async function issue(db: Transactor, member: Member, setId: string, siteUrl: string, reissue: Reissue | null) {
  try {
    return await db.transaction(async (tx) => {
      // Signing a set back from service supersedes the certificate it came in with.
      const supersede = reissue ?? await serviceReissue(tx, setId)
      const frozen = await freezeCertificate(tx, member, setId, siteUrl, supersede)
      const stored = await storeCertificate(tx, member, setId, frozen, supersede?.reason ?? null)
      await closeService(tx, member, setId, stored.id)
      return stored
    })
  }
  catch (error) {
    if (isOneValidViolation(error)) fail(409, 'This set was signed a moment ago by another request; its certificate is in the list.')
    throw error
  }
}

/** The re-issue a signing under an open service makes of the set's valid certificate, or null. */
async function serviceReissue(tx: Executor, setId: string): Promise<Reissue | null> {
  const open = await openService(tx, setId)
  if (!open) return null
  const [valid] = await tx.select({ id: certificates.id }).from(certificates).where(and(eq(certificates.setId, setId), eq(certificates.status, 'valid')))
  return valid ? { id: valid.id, reason: serviceReissueReason(open) } : null
}

export async function findCertificate(db: Executor, workshopId: string, id: string): Promise<Certificate> {
  const [row] = await db.select().from(certificates).where(and(eq(certificates.id, id), eq(certificates.workshopId, workshopId)))
  if (!row) fail(404, 'No such certificate in this workshop.')
  return row
}

/**
 * The stored PDF (A4, with the mark of the certificate's status), or the frozen
 * content rendered on US Letter in a worker thread. `null` while the PDF job has
 * not stored the current rendering yet.
 */
export async function certificatePdf(db: Executor, storage: BlobStorage, workshopId: string, id: string, paper: Paper) {
  const cert = await findCertificate(db, workshopId, id)
  if (cert.pdfStatus !== 'ready') return { pending: true as const, number: cert.number }
  if (paper === 'A4') {
    const bytes = await storage.get(cert.pdfKey)
    if (!bytes) fail(404, 'The PDF of this certificate is missing from storage.')
    return { pending: false as const, bytes, filename: `${cert.number}.pdf` }
  }
  const bytes = await renderPdfOffThread(parseCertificateContent(cert.content), cert.status, paper)
  return { pending: false as const, bytes, filename: `${cert.number}-letter.pdf` }
}

/** Revokes a valid or superseded certificate; its certified pieces go back to approved. */
export async function revokeCertificate(db: Database, member: Member, id: string, reason: string) {
  return db.transaction(async (tx) => {
    const [cert] = await tx.select().from(certificates)
      .where(and(eq(certificates.id, id), eq(certificates.workshopId, member.workshopId))).for('update')
    if (!cert) fail(404, 'No such certificate in this workshop.')
    if (cert.status === 'revoked') fail(409, 'This certificate is already revoked.')
    const now = new Date()
    // The PDF is rendered again with a REVOKED mark on every page.
    await tx.update(certificates).set({ status: 'revoked', revokedReason: reason, revokedAt: now, revokedBy: member.userId, ...PDF_PENDING() }).where(eq(certificates.id, id))
    if (cert.status === 'valid') {
      // Without a valid certificate the pieces are approved again, and can be reopened or re-signed.
      await tx.update(pieces).set({ stage: 'approved', updatedAt: now }).where(and(eq(pieces.setId, cert.setId), eq(pieces.stage, 'certified')))
    }
    await audit(tx, {
      workshopId: member.workshopId, actorId: member.userId, action: 'certificate.revoke', subjectType: 'certificate', subjectId: id,
      fromState: cert.status, toState: 'revoked', reason, details: { number: cert.number },
    })
    return { id, number: cert.number, status: 'revoked' as const }
  })
}

/**
 * The e-mail a certificate would be sent with, exactly as the sender builds it:
 * only a valid certificate is mailed (a revoked or superseded one answers 409).
 */
export async function prepareCertificateMail(db: Executor, workshopId: string, id: string, to: string | undefined) {
  const cert = await findCertificate(db, workshopId, id)
  if (cert.status === 'revoked') fail(409, 'A revoked certificate cannot be sent.')
  if (cert.status === 'superseded') {
    // Decided: a superseded certificate is never mailed; the buyer gets the current one, sent from its own row.
    const [current] = cert.supersededById ? await db.select({ number: certificates.number }).from(certificates).where(eq(certificates.id, cert.supersededById)) : []
    fail(409, `Certificate ${cert.number} has been superseded${current ? ` by ${current.number}` : ''}; send the current certificate instead.`)
  }
  const content = parseCertificateContent(cert.content)
  return { cert, to: to ?? content.buyer.email, mail: certificateMail(content, cert.status) }
}

/** Queues the certificate e-mail to the buyer (or another address); a background job sends it. */
export async function sendCertificate(db: Transactor, member: Member, id: string, to: string | undefined) {
  return db.transaction(async (tx) => {
    const { cert, to: address, mail } = await prepareCertificateMail(tx, member.workshopId, id, to)
    const message = await queueMail(tx, {
      workshopId: member.workshopId, kind: 'certificate', to: address, ...mail,
      certificateId: cert.id, setId: cert.setId, requestedBy: member.userId,
    })
    await audit(tx, {
      workshopId: member.workshopId, actorId: member.userId, action: 'certificate.send', subjectType: 'certificate', subjectId: id,
      details: { number: cert.number, to: address, messageId: message.id },
    })
    return message
  })
}
