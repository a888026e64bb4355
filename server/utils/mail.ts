import { and, desc, eq, isNull } from 'drizzle-orm'
import nodemailer, { type Transporter } from 'nodemailer'
import { certificates, mailMessages, type MailMessage } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { CertificateContent } from '../../shared/certificates/content'
import { fail } from './http-errors'
import type { BlobStorage } from './storage'

export interface SmtpConfig { host: string, port: number | string, user: string, pass: string, from: string }

export interface MailBody { subject: string, text: string, html: string }

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, c => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' })[c]!)

/** A simple HTML version of short paragraphs, with links made clickable. */
function htmlOf(title: string, paragraphs: string[]) {
  const body = paragraphs.map(p => `<p style="margin:0 0 12px">${escapeHtml(p).replace(/(https?:\/\/\S+)/g, '<a href="$1" style="color:#6e5416">$1</a>')}</p>`).join('\n')
  return `<!doctype html><html><body style="font-family:'IBM Plex Sans',Arial,sans-serif;color:#1f2329;background:#f6f3ec;padding:24px">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #d9d0bd;border-radius:8px;padding:24px">
<h1 style="font-size:18px;margin:0 0 16px">${escapeHtml(title)}</h1>
${body}
<p style="margin:16px 0 0;color:#7b818a;font-size:12px">Sent by Tonewright.</p>
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

/** Queued messages that have no job yet (queued while the queue was down, or put back by a retry). */
export async function unscheduledMail(db: Executor, limit = 100) {
  return db.select({ id: mailMessages.id }).from(mailMessages)
    .where(and(eq(mailMessages.status, 'queued'), isNull(mailMessages.jobId))).limit(limit)
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

export type DeliveryOutcome = 'sent' | 'already-sent' | 'missing' | Error

/**
 * Delivers one outbox message. The row stays locked while the SMTP server talks,
 * so two workers can never send it twice; a message already sent is skipped, which
 * makes a retried job harmless. On failure the attempt and the reason are saved
 * (status stays queued while retries remain, then failed) and the error returned
 * for the queue to retry.
 */
export async function deliverMessage(db: Database, storage: BlobStorage, smtp: SmtpConfig, messageId: string, finalAttempt: boolean): Promise<DeliveryOutcome> {
  return db.transaction(async (tx) => {
    const [message] = await tx.select().from(mailMessages).where(eq(mailMessages.id, messageId)).for('update')
    if (!message) return 'missing'
    if (message.status === 'sent') return 'already-sent'
    try {
      const attachments = []
      if (message.certificateId) {
        const [cert] = await tx.select({ number: certificates.number, pdfKey: certificates.pdfKey }).from(certificates).where(eq(certificates.id, message.certificateId))
        const bytes = cert ? await storage.get(cert.pdfKey) : null
        if (!cert || !bytes) throw new Error('The certificate PDF is missing from storage.')
        attachments.push({ filename: `${cert.number}.pdf`, content: Buffer.from(bytes), contentType: 'application/pdf' })
      }
      const info = await mailTransport(smtp).sendMail({
        from: smtp.from, to: message.to, subject: message.subject, text: message.text, html: message.html, attachments,
        // A fixed Message-ID lets a receiving server recognise a repeat.
        messageId: `<${message.id}@tonewright.mail>`,
      })
      await tx.update(mailMessages).set({ status: 'sent', attempts: message.attempts + 1, sentAt: new Date(), updatedAt: new Date(), lastError: info.rejected?.length ? `Rejected: ${info.rejected.join(', ')}` : null })
        .where(eq(mailMessages.id, messageId))
      return 'sent'
    }
    catch (error) {
      const reason = (error as Error).message?.slice(0, 500) || 'Unknown error'
      await tx.update(mailMessages).set({ status: finalAttempt ? 'failed' : 'queued', attempts: message.attempts + 1, lastError: reason, updatedAt: new Date() })
        .where(eq(mailMessages.id, messageId))
      return error instanceof Error ? error : new Error(reason)
    }
  })
}
