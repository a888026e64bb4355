// Worker-thread entry (built to <output>/server/workers/certificate-pdf.mjs, see
// server/workers/entries.ts): renders one certificate PDF off the thread that answers requests.
import type { CertificateContent } from '../../shared/certificates/content'
import { renderCertificatePdf, type Paper } from '../utils/certificate-pdf'
import { lowerThreadPriority } from './lowerThreadPriority'

lowerThreadPriority()

export interface CertificatePdfTask { content: CertificateContent, status: string, paper: Paper }

export default function render(task: CertificatePdfTask): Promise<Uint8Array> {
  return renderCertificatePdf(task.content, task.status, task.paper)
}
