import { and, eq } from 'drizzle-orm'
import { certificates, pieces } from '../database/schema'
import type { Executor } from '../database/client'
import { certificateChanges, readHeading } from '../../shared/certificates/contentChanges'
import type { Member } from './auth'
import { audit } from './audit'
import type { FrozenCertificate } from './certificate-freeze'
import { PDF_PENDING, certificatePdfKey } from './certificate-pdf-job'

/**
 * Store: persists the frozen certificate in the caller's transaction: supersedes the
 * previous one, inserts the new row, moves approved pieces to certified and audits.
 * The rows are left with `pdf_status` pending, which is the PDF job's queue entry:
 * the job's sweep schedules every pending rendering, so the enqueue commits or rolls
 * back with the certificate.
 */
export async function storeCertificate(tx: Executor, member: Member, setId: string, frozen: FrozenCertificate, reason: string | null) {
  const { content, contentHash, number, code, signedAt, previous } = frozen
  // A re-issue says what it changed against the certificate it supersedes (e.g. the buyer after an edit of the set).
  const previousHeading = previous ? readHeading(previous.content) : null
  const changes = previousHeading ? certificateChanges(previousHeading, content) : []
  if (previous) {
    // First the old one stops being valid (the one-valid-per-set index), and its PDF is rendered again with its mark.
    await tx.update(certificates).set({ status: 'superseded', ...PDF_PENDING() }).where(eq(certificates.id, previous.id))
  }
  const [certificate] = await tx.insert(certificates).values({
    workshopId: member.workshopId, setId, number, code, content, contentHash,
    pdfKey: certificatePdfKey(member.workshopId, number, 'valid'), ...PDF_PENDING(),
    signerId: member.userId, signerName: member.name, signedAt, supersedesId: previous?.id ?? null, reissueReason: reason,
  }).returning()
  if (previous) {
    await tx.update(certificates).set({ supersededById: certificate!.id }).where(eq(certificates.id, previous.id))
    await audit(tx, {
      workshopId: member.workshopId, actorId: member.userId, action: 'certificate.reissue', subjectType: 'certificate', subjectId: previous.id,
      fromState: 'valid', toState: 'superseded', reason, details: { number: previous.number, supersededBy: number, changes },
    })
  }
  await tx.update(pieces).set({ stage: 'certified', updatedAt: signedAt })
    .where(and(eq(pieces.setId, setId), eq(pieces.stage, 'approved')))
  await audit(tx, {
    workshopId: member.workshopId, actorId: member.userId, action: 'certificate.sign', subjectType: 'certificate', subjectId: certificate!.id,
    toState: 'valid', reason, details: { number, setId, hash: contentHash, supersedes: previous?.number ?? null, pieces: frozen.pieceCount, ...(previous ? { changes } : {}) },
  })
  return { id: certificate!.id, number, code, pdfStatus: 'pending' as const, changes }
}
