import { pathToFileURL } from 'node:url'
import Piscina from 'piscina'
import type { CertificateContent } from '../../shared/certificates/content'
import type { CertificatePdfTask } from '../workers/certificate-pdf'
import { builtWorkerFile } from './built-worker'
import { renderCertificatePdf, type Paper } from './certificate-pdf'

let pool: Piscina<CertificatePdfTask, Uint8Array> | null | undefined

/**
 * Renders a certificate PDF in a worker thread (about 2 s of CPU for a 52-piece set,
 * which must never stall the server). One thread: rendering is occasional and the
 * analysis pool needs the cores. Without a built worker (scripts, `nuxt dev`) it
 * renders in this thread.
 */
export async function renderPdfOffThread(content: CertificateContent, status: string, paper: Paper): Promise<Uint8Array> {
  if (pool === undefined) {
    const file = builtWorkerFile('certificate-pdf')
    pool = file ? new Piscina<CertificatePdfTask, Uint8Array>({ filename: pathToFileURL(file).href, minThreads: 0, maxThreads: 1, idleTimeout: 60_000 }) : null
  }
  if (!pool) return renderCertificatePdf(content, status, paper)
  return new Uint8Array(await pool.run({ content, status, paper }))
}

export async function closePdfPool() {
  const current = pool
  pool = undefined
  await current?.destroy()
}
