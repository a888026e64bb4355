import { and, desc, eq, isNull, lt, or, sql } from 'drizzle-orm'
import nodemailer, { type Transporter } from 'nodemailer'
import { certificates, mailMessages, type MailMessage } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { CertificateContent } from '../../shared/certificates/content'
import { hex, WHITE } from '../../shared/look/palette'
import { fail } from './http-errors'
import type { BlobStorage } from './storage'

export interface SmtpConfig { host: string, port: number | string, user: string, pass: string, from: string }

export interface MailBody { subject: string, text: string, html: string }

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, c => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' })[c]!)

/** A simple HTML version of short paragraphs, with links made clickable. */
function htmlOf(title: string, paragraphs: string[]) {
  const body = paragraphs.map(p => `<p style="margin:0 0 12px">${escapeHtml(p).replace(/(https?:\/\/\S+)/g, `<a href="$1" style="color:${hex('brass-700')}">$1</a>`)}</p>`).join('\n')
  return `<!doctype html><html><body style="font-family:'IBM Plex Sans',Arial,sans-serif;color:${hex('ink')};background:${hex('paper')};padding:24px">
<div style="max-width:560px;margin:0 auto;background:${WHITE};border:1px solid ${hex('paper-line')};border-radius:8px;padding:24px">
<h1 style="font-size:18px;margin:0 0 16px">${escapeHtml(title)}</h1>
${body}
<p style="margin:16px 0 0;color:${hex('ink-faint')};font-size:12px">Sent by Tonewright.</p>
</div></body></html>`
}

function mail(title: string, subject: string, paragraphs: string[]): MailBody {
  return { subject, text: `${paragraphs.join('\n\n')}\n\n-- \nSent by Tonewright.\n`, html: htmlOf(title, paragraphs) }
}

export function certificateMail(content: CertificateContent, status: string): MailBody {
  const i = content.instrument
  return mail(`Tuning certificate ${content.number}`, `Tuning certificate ${content.number}: ${i.model}, serial ${i.serial}`, [
    `Dear ${content.buyer.name},`,
    `attached is the tuning certificate ${content.number} for your ${i.model} (serial ${i.serial}, ${i.pieceCount} pieces), signed by ${content.signer.name} of ${content.workshop.name}.${status === 'superseded' ? ' Note: this certificate has since been superseded by a newer one.' : ''}`,
    `Anyone can check that it is genuine and still valid at ${content.verificationUrl}`,
    `With kind regards,\n${content.workshop.name}`,
  ])
}

export function invitationMail(input: { workshopName: string, inviterName: string, role: string, link: string, expiresAt: Date, hasAccount?: boolean }): MailBody {
  return mail(`Join ${input.workshopName} on Tonewright`, `${input.inviterName} invites you to ${input.workshopName} on Tonewright`, [
    `${input.inviterName} invites you to join ${input.workshopName} on Tonewright as ${input.role.toLowerCase()}.`,
    input.hasAccount
      ? `You already have a Tonewright account with this address: sign in with it, then accept the invitation here: ${input.link}`
      : `Accept the invitation and choose your password here: ${input.link}`,
    `The link works once and expires on ${input.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC. If you did not expect it, ignore this e-mail.`,
  ])
}

export function passwordResetMail(input: { name: string, link: string, expiresAt: Date }): MailBody {
  return mail('Reset your Tonewright password', 'Reset your Tonewright password', [
    `Hello ${input.name},`,
    `someone (hopefully you) asked to reset the password of your Tonewright account. Choose a new one here: ${input.link}`,
    `The link works once and expires on ${input.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC. If you did not ask for it, ignore this e-mail: your password stays as it is.`,
  ])
}

export type QueueInput = Pick<MailMessage, 'kind' | 'to' | 'subject' | 'text' | 'html'> & Partial<Pick<MailMessage, 'workshopId' | 'certificateId' | 'setId' | 'requestedBy'>>

/** Adds a message to the outbox (inside the caller's transaction); the queue delivers it after commit. */
export async function queueMail(tx: Executor, input: QueueInput) {
  const [row] = await tx.insert(mailMessages).values({ ...input, status: 'queued' }).returning({
    id: mailMessages.id, kind: mailMessages.kind, to: mailMessages.to, status: mailMessages.status, createdAt: mailMessages.createdAt,
  })
  return row!
}

/** The messages of a set (for its page), newest first, without bodies. */
export async function listSetMail(db: Executor, workshopId: string, setId: string) {
  return db.select({
    id: mailMessages.id, kind: mailMessages.kind, to: mailMessages.to, subject: mailMessages.subject, status: mailMessages.status,
    attempts: mailMessages.attempts, lastError: mailMessages.lastError, createdAt: mailMessages.createdAt, updatedAt: mailMessages.updatedAt,
    sentAt: mailMessages.sentAt, certificateId: mailMessages.certificateId, certificateNumber: certificates.number,
  }).from(mailMessages).leftJoin(certificates, eq(certificates.id, mailMessages.certificateId))
    .where(and(eq(mailMessages.workshopId, workshopId), eq(mailMessages.setId, setId)))
    .orderBy(desc(mailMessages.createdAt)).limit(100)
}

/** Puts a failed message back in the queue (its attempts so far are kept). */
export async function retryMail(db: Database, workshopId: string, id: string) {
  const [row] = await db.update(mailMessages).set({ status: 'queued', jobId: null, updatedAt: new Date() })
    .where(and(eq(mailMessages.id, id), eq(mailMessages.workshopId, workshopId), eq(mailMessages.status, 'failed')))
    .returning({ id: mailMessages.id, status: mailMessages.status })
  if (row) return row
  const [existing] = await db.select({ status: mailMessages.status }).from(mailMessages).where(and(eq(mailMessages.id, id), eq(mailMessages.workshopId, workshopId)))
  if (!existing) fail(404, 'No such message in this workshop.')
  fail(409, existing.status === 'sent' ? 'This message was already sent.' : 'This message is already queued.')
}

/**
 * Queued messages that need a job: none yet (queued while the queue was down, put
 * back by a retry, or waiting for a PDF that is now ready), or claimed by a worker
 * whose lease ran out (it died mid-send). Certificate e-mails wait for their PDF.
 */
export const needsJob = () => and(
  eq(mailMessages.status, 'queued'),
  or(isNull(mailMessages.jobId), lt(mailMessages.claimedUntil, sql`now()`)),
  sql`not exists (select 1 from ${certificates} where ${certificates.id} = ${mailMessages.certificateId} and ${certificates.status} = 'valid' and ${certificates.pdfStatus} = 'pending')`,
)

export async function unscheduledMail(db: Executor, limit = 100) {
  return db.select({ id: mailMessages.id }).from(mailMessages).where(needsJob()).limit(limit)
}

let transport: Transporter | undefined
let transportKey = ''

export function mailTransport(config: SmtpConfig): Transporter {
  const key = `${config.host}:${config.port}:${config.user}`
  if (!transport || key !== transportKey) {
    const port = Number(config.port)
    transport = nodemailer.createTransport({
      host: config.host,
      port,
      secure: port === 465,
      auth: config.user ? { user: config.user, pass: config.pass } : undefined,
      // A loopback catcher speaks plain SMTP; a real provider is reached with STARTTLS when it offers it.
      ignoreTLS: config.host === '127.0.0.1' || config.host === 'localhost',
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    })
    transportKey = key
  }
  return transport
}

export type DeliveryOutcome = 'sent' | 'already-sent' | 'not-queued' | 'missing' | 'claimed-elsewhere' | 'waiting-for-pdf' | 'refused' | Error

/** Who delivers, and for how long a claim holds (longer than any SMTP conversation may take). */
export interface DeliveryLease { workerId: string, leaseS: number }

type Claim = { message: MailMessage, certificate: { number: string, pdfKey: string } | null }

/**
 * Claims one outbox message for this worker: under the row lock, a message already
 * sent is skipped, one claimed by another worker whose lease has not run out is
 * left to it, and a certificate e-mail waits for its PDF (and is refused when the
 * certificate stopped being valid). The lease is written and committed before any
 * SMTP talk, so a worker that dies mid-send leaves a claim that expires.
 */
export async function claimMessage(db: Database, messageId: string, lease: DeliveryLease): Promise<Claim | Exclude<DeliveryOutcome, 'sent' | Error>> {
  return db.transaction(async (tx) => {
    const [message] = await tx.select().from(mailMessages).where(eq(mailMessages.id, messageId)).for('update')
    if (!message) return 'missing'
    if (message.status === 'sent') return 'already-sent'
    if (message.status !== 'queued') return 'not-queued'
    if (message.claimedBy && message.claimedBy !== lease.workerId && message.claimedUntil && message.claimedUntil > new Date()) return 'claimed-elsewhere'
    let certificate: Claim['certificate'] = null
    if (message.certificateId) {
      const [cert] = await tx.select({ number: certificates.number, status: certificates.status, pdfStatus: certificates.pdfStatus, pdfKey: certificates.pdfKey })
        .from(certificates).where(eq(certificates.id, message.certificateId))
      if (!cert || cert.status !== 'valid') {
        // Decided: only a valid certificate is mailed; a superseded or revoked one is never attached.
        const lastError = cert ? `Certificate ${cert.number} was ${cert.status} before this e-mail went out, so it was not sent.` : 'The certificate of this e-mail no longer exists.'
        await tx.update(mailMessages).set({ status: 'failed', lastError, claimedBy: null, claimedUntil: null, updatedAt: new Date() }).where(eq(mailMessages.id, messageId))
        return 'refused'
      }
      if (cert.pdfStatus !== 'ready') {
        // Back to the outbox without a job: the sweep schedules it once the PDF is stored.
        await tx.update(mailMessages).set({ jobId: null, claimedBy: null, claimedUntil: null }).where(eq(mailMessages.id, messageId))
        return 'waiting-for-pdf'
      }
      certificate = { number: cert.number, pdfKey: cert.pdfKey }
    }
    await tx.update(mailMessages).set({ claimedBy: lease.workerId, claimedUntil: sql`now() + make_interval(secs => ${lease.leaseS})` })
      .where(eq(mailMessages.id, messageId))
    return { message, certificate }
  })
}

/**
 * Delivers one outbox message: claim (see claimMessage), talk SMTP without holding
 * a transaction open, then record the outcome and drop the claim. A retried job for
 * a sent message is harmless. On failure the attempt and the reason are saved
 * (queued while retries remain, then failed) and the error returned for the queue.
 */
export async function deliverMessage(db: Database, storage: BlobStorage, smtp: SmtpConfig, messageId: string, finalAttempt: boolean, lease: DeliveryLease): Promise<DeliveryOutcome> {
  const claim = await claimMessage(db, messageId, lease)
  if (typeof claim === 'string') return claim
  const { message, certificate } = claim
  try {
    const attachments = []
    if (certificate) {
      const bytes = await storage.get(certificate.pdfKey)
      if (!bytes) throw new Error('The certificate PDF is missing from storage.')
      attachments.push({ filename: `${certificate.number}.pdf`, content: Buffer.from(bytes), contentType: 'application/pdf' })
    }
    const info = await mailTransport(smtp).sendMail({
      from: smtp.from, to: message.to, subject: message.subject, text: message.text, html: message.html, attachments,
      // A fixed Message-ID lets a receiving server recognise a repeat.
      messageId: `<${message.id}@tonewright.mail>`,
    })
    await db.update(mailMessages).set({
      status: 'sent', attempts: sql`${mailMessages.attempts} + 1`, sentAt: new Date(), updatedAt: new Date(), claimedBy: null, claimedUntil: null,
      lastError: info.rejected?.length ? `Rejected: ${info.rejected.join(', ')}` : null,
    }).where(eq(mailMessages.id, messageId))
    return 'sent'
  }
  catch (error) {
    const reason = (error as Error).message?.slice(0, 500) || 'Unknown error'
    await db.update(mailMessages).set({ status: finalAttempt ? 'failed' : 'queued', attempts: sql`${mailMessages.attempts} + 1`, lastError: reason, updatedAt: new Date(), claimedBy: null, claimedUntil: null })
      .where(and(eq(mailMessages.id, messageId), eq(mailMessages.claimedBy, lease.workerId), eq(mailMessages.status, 'queued')))
    return error instanceof Error ? error : new Error(reason)
  }
}
