import { and, eq, isNull, lt, or, sql } from 'drizzle-orm'
import type PgBoss from 'pg-boss'
import { certificates } from '../database/schema'
import type { CertificateStatus } from '../../shared/records/lists'
import type { Database } from '../database/client'
import { parseCertificateContent } from '../../shared/schemas/certificateContent'
import { renderPdfOffThread } from './certificate-pdf-pool'
import { ensureQueue } from './job-queue'
import type { BlobStorage } from './storage'

export const CERTIFICATE_PDF_QUEUE = 'certificate-pdf'
/** A pending PDF whose job has not finished in this time is scheduled again (the job or its worker died). */
const RESCHEDULE_AFTER_S = 600

/** The columns that ask for a (new) rendering; set in the transaction that signs, supersedes or revokes. */
export const PDF_PENDING = () => ({ pdfStatus: 'pending' as const, pdfJobId: null, pdfRequestedAt: new Date() })

/** Where the rendering for a status is stored: the valid one as before, a marked one beside it. */
export function certificatePdfKey(workshopId: string, number: string, status: CertificateStatus) {
  return `workshops/${workshopId}/certificates/${number}${status === 'valid' ? '' : `-${status}`}.pdf`
}

export type PdfOutcome = 'rendered' | 'stale' | 'ready' | 'missing'

/**
 * Renders the certificate's PDF for its current status (in a worker thread) and
 * stores it, then marks it ready, but only if the status is still the one rendered:
 * a status that changed meanwhile has asked for another rendering already.
 */
export async function renderPendingPdf(db: Database, storage: BlobStorage, certificateId: string): Promise<PdfOutcome> {
  const [cert] = await db.select({ id: certificates.id, workshopId: certificates.workshopId, number: certificates.number, status: certificates.status, content: certificates.content, pdfStatus: certificates.pdfStatus })
    .from(certificates).where(eq(certificates.id, certificateId))
  if (!cert) return 'missing'
  if (cert.pdfStatus === 'ready') return 'ready'
  const bytes = await renderPdfOffThread(parseCertificateContent(cert.content), cert.status, 'A4')
  const key = certificatePdfKey(cert.workshopId, cert.number, cert.status)
  await storage.put(key, bytes, 'application/pdf')
  const [done] = await db.update(certificates).set({ pdfStatus: 'ready', pdfKey: key, pdfJobId: null })
    .where(and(eq(certificates.id, cert.id), eq(certificates.status, cert.status), eq(certificates.pdfStatus, 'pending')))
    .returning({ id: certificates.id })
  return done ? 'rendered' : 'stale'
}

/** Pending PDFs without a job, or whose job has taken too long. */
async function unscheduledPdfs(db: Database) {
  return db.select({ id: certificates.id }).from(certificates).where(and(
    eq(certificates.pdfStatus, 'pending'),
    or(isNull(certificates.pdfJobId), lt(certificates.pdfRequestedAt, sql`now() - make_interval(secs => ${RESCHEDULE_AFTER_S})`)),
  )).limit(100)
}

/** The PDF job beside the mail worker, on the same pg-boss instance. */
export function certificatePdfJob(db: Database, storage: BlobStorage, onRendered: () => void) {
  return {
    queue: CERTIFICATE_PDF_QUEUE,
    async start(boss: PgBoss) {
      await ensureQueue(boss, { name: CERTIFICATE_PDF_QUEUE, retryLimit: 5, retryDelay: 5, retryBackoff: true, expireInSeconds: 300 })
      await boss.work<{ certificateId: string }>(CERTIFICATE_PDF_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
        if (!job) return
        const outcome = await renderPendingPdf(db, storage, job.data.certificateId)
        if (outcome === 'rendered') onRendered()
        // The status changed while this job rendered: let the sweep schedule the rendering it now needs.
        if (outcome === 'stale') {
          await db.update(certificates).set({ pdfJobId: null })
            .where(and(eq(certificates.id, job.data.certificateId), eq(certificates.pdfStatus, 'pending'), or(eq(certificates.pdfJobId, job.id), eq(certificates.pdfJobId, 'claimed'))))
        }
      })
    },
    /** Schedules pending PDFs; the claim (job id set from null, or from an old one) keeps two instances from doubling a job. */
    async sweep(boss: PgBoss) {
      for (const { id } of await unscheduledPdfs(db)) {
        const [claimed] = await db.update(certificates).set({ pdfJobId: 'claimed', pdfRequestedAt: new Date() })
          .where(and(eq(certificates.id, id), eq(certificates.pdfStatus, 'pending'),
            or(isNull(certificates.pdfJobId), lt(certificates.pdfRequestedAt, sql`now() - make_interval(secs => ${RESCHEDULE_AFTER_S})`))))
          .returning({ id: certificates.id })
        if (!claimed) continue
        try {
          const jobId = await boss.send(CERTIFICATE_PDF_QUEUE, { certificateId: id })
          await db.update(certificates).set({ pdfJobId: jobId ?? 'claimed' }).where(and(eq(certificates.id, id), eq(certificates.pdfStatus, 'pending')))
        }
        catch (error) {
          await db.update(certificates).set({ pdfJobId: null }).where(eq(certificates.id, id))
          throw error
        }
      }
    },
  }
}

export type BackgroundJob = ReturnType<typeof certificatePdfJob>
