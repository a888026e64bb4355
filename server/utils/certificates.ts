import { createHash, randomBytes, timingSafeEqual } from 'node:crypto'
import { and, asc, desc, eq, inArray, like, sql } from 'drizzle-orm'
import {
  certificates, lots, mailMessages, pieces, reviews, sets, strikes, templateVersions, workshops, type Certificate,
} from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { PartialMatch } from '../../shared/analysis/types'
import { ROLE_LABELS } from '../../shared/auth/roles'
import { canonicalJson } from '../../shared/certificates/canonicalJson'
import { buildCertificateContent, type CertificateContent } from '../../shared/certificates/content'
import type { StoredPartial } from '../../shared/certificates/uncertaintyText'
import type { Member } from './auth'
import { audit } from './audit'
import { renderCertificatePdf, type Paper } from './certificate-pdf'
import { fail } from './http-errors'
import { certificateMail, queueMail } from './mail'
import type { BlobStorage } from './storage'

/** SHA-256 of the content's canonical JSON, hex. */
export function hashContent(content: unknown): string {
  return createHash('sha256').update(canonicalJson(content), 'utf8').digest('hex')
}

/** 96 random bits, URL-safe: well above the 80 bits an unguessable code needs. */
export function newVerificationCode(): string {
  return randomBytes(12).toString('base64url')
}

export function verificationUrl(siteUrl: string, code: string) {
  return `${siteUrl.replace(/\/+$/, '')}/verify/${code}`
}

async function nextNumber(tx: Executor, workshopId: string, year: number) {
  const prefix = `TW-${year}-`
  const [row] = await tx.select({ n: sql<number>`coalesce(max(split_part(${certificates.number}, '-', 3)::int), 0)` })
    .from(certificates).where(and(eq(certificates.workshopId, workshopId), like(certificates.number, `${prefix}%`)))
  return `${prefix}${String((row?.n ?? 0) + 1).padStart(4, '0')}`
}

/**
 * Signs a certificate for a set whose every live piece is approved (or already
 * certified, for a re-issue): freezes the content, hashes it, stores the PDF and
 * moves approved pieces to certified, all in one transaction. A valid certificate
 * of the same set is superseded by the new one.
 */
export async function signCertificate(db: Database, storage: BlobStorage, member: Member, setId: string, siteUrl: string) {
  return db.transaction(async (tx) => {
    // The workshop row lock serialises numbering within a workshop.
    const [workshop] = await tx.select().from(workshops).where(eq(workshops.id, member.workshopId)).for('update')
    const [set] = await tx.select().from(sets).where(and(eq(sets.id, setId), eq(sets.workshopId, member.workshopId))).for('update')
    if (!workshop || !set) fail(404, 'No such set in this workshop.')
    const rows = await tx.select({ piece: pieces, template: templateVersions }).from(pieces)
      .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
      .where(eq(pieces.setId, setId)).orderBy(asc(pieces.position)).for('update', { of: pieces })
    const live = rows.filter(r => r.piece.stage !== 'scrapped')
    const notReady = live.filter(r => !['approved', 'certified', 'shipped'].includes(r.piece.stage))
    if (live.length === 0) fail(409, 'This set has no pieces to certify.')
    if (notReady.length) {
      const names = notReady.slice(0, 5).map(r => r.piece.note).join(', ')
      fail(409, `Not every piece is approved yet (${notReady.length} left: ${names}${notReady.length > 5 ? ', …' : ''}).`)
    }
    if (live.some(r => !r.piece.approvedStrikeId)) fail(409, 'A piece has no approved strike; reopen and approve it again.')
    const strikeIds = live.map(r => r.piece.approvedStrikeId!)
    const strikeRows = await tx.select().from(strikes).where(and(inArray(strikes.id, strikeIds), eq(strikes.workshopId, member.workshopId)))
    const strikeById = new Map(strikeRows.map(s => [s.id, s]))
    const overrides = await tx.select({ strikeId: reviews.strikeId, reason: reviews.overrideReason }).from(reviews)
      .where(and(inArray(reviews.strikeId, strikeIds), eq(reviews.decision, 'approve'))).orderBy(desc(reviews.createdAt))
    const overrideByStrike = new Map<string, string | null>()
    for (const o of overrides) if (o.strikeId && !overrideByStrike.has(o.strikeId)) overrideByStrike.set(o.strikeId, o.reason)
    const lotRows = await tx.select().from(lots).where(eq(lots.workshopId, member.workshopId))
    const [previous] = await tx.select().from(certificates)
      .where(and(eq(certificates.setId, setId), eq(certificates.status, 'valid'))).for('update')

    const signedAt = new Date()
    const number = await nextNumber(tx, member.workshopId, signedAt.getUTCFullYear())
    const code = newVerificationCode()
    const content = buildCertificateContent({
      number, verificationUrl: verificationUrl(siteUrl, code), supersedes: previous?.number ?? null, signedAt,
      signer: { name: member.name, role: ROLE_LABELS[member.role] },
      workshop: { name: workshop.name, address: workshop.address },
      set, scrappedCount: rows.length - live.length, lots: lotRows,
      pieces: live.map(({ piece, template }) => {
        const strike = strikeById.get(piece.approvedStrikeId!)
        if (!strike) fail(409, `The approved strike of ${piece.note} is missing.`)
        const analysis = strike.analysis as { matches?: PartialMatch[], partials?: StoredPartial[] }
        return {
          position: piece.position, note: piece.note, targetHz: piece.targetHz, lotId: piece.lotId, template,
          strike: { temperatureC: strike.temperatureC, humidityPct: strike.humidityPct, verdict: strike.verdict, engineVersion: strike.engineVersion, matches: analysis.matches ?? [], partials: analysis.partials ?? [] },
          overrideReason: overrideByStrike.get(strike.id) ?? null,
        }
      }),
    })
    const contentHash = hashContent(content)
    const pdfKey = `workshops/${member.workshopId}/certificates/${number}.pdf`
    await storage.put(pdfKey, await renderCertificatePdf(content, 'valid', 'A4'), 'application/pdf')
    const [certificate] = await tx.insert(certificates).values({
      workshopId: member.workshopId, setId, number, code, content: content as unknown as Record<string, unknown>, contentHash, pdfKey,
      signerId: member.userId, signerName: member.name, signedAt, supersedesId: previous?.id ?? null,
    }).returning()
    if (previous) {
      await tx.update(certificates).set({ status: 'superseded', supersededById: certificate!.id }).where(eq(certificates.id, previous.id))
      await audit(tx, {
        workshopId: member.workshopId, actorId: member.userId, action: 'certificate.reissue', subjectType: 'certificate', subjectId: previous.id,
        fromState: 'valid', toState: 'superseded', details: { number: previous.number, supersededBy: number },
      })
    }
    await tx.update(pieces).set({ stage: 'certified', updatedAt: signedAt })
      .where(and(eq(pieces.setId, setId), eq(pieces.stage, 'approved')))
    await audit(tx, {
      workshopId: member.workshopId, actorId: member.userId, action: 'certificate.sign', subjectType: 'certificate', subjectId: certificate!.id,
      toState: 'valid', details: { number, setId, hash: contentHash, supersedes: previous?.number ?? null, pieces: live.length },
    })
    return { id: certificate!.id, number, code }
  })
}

export async function findCertificate(db: Executor, workshopId: string, id: string): Promise<Certificate> {
  const [row] = await db.select().from(certificates).where(and(eq(certificates.id, id), eq(certificates.workshopId, workshopId)))
  if (!row) fail(404, 'No such certificate in this workshop.')
  return row
}

/** The workshop's certificates, newest first, with their set and latest mail status. */
export async function listCertificates(db: Executor, workshopId: string, setId?: string) {
  const rows = await db.select({
    id: certificates.id, number: certificates.number, code: certificates.code, status: certificates.status,
    setId: certificates.setId, setName: sets.name, setSerial: sets.serial, model: sets.model,
    buyerName: sets.buyerName, buyerOrganisation: sets.buyerOrganisation, buyerEmail: sets.buyerEmail,
    signerName: certificates.signerName, signedAt: certificates.signedAt, contentHash: certificates.contentHash,
    supersedesId: certificates.supersedesId, supersededById: certificates.supersededById,
    revokedReason: certificates.revokedReason, revokedAt: certificates.revokedAt,
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

/** The stored PDF (A4, as signed), or the frozen content rendered on US Letter. */
export async function certificatePdf(db: Executor, storage: BlobStorage, workshopId: string, id: string, paper: Paper) {
  const cert = await findCertificate(db, workshopId, id)
  if (paper === 'A4') {
    const bytes = await storage.get(cert.pdfKey)
    if (!bytes) fail(404, 'The PDF of this certificate is missing from storage.')
    return { bytes, filename: `${cert.number}.pdf` }
  }
  const bytes = await renderCertificatePdf(cert.content as unknown as CertificateContent, 'valid', paper)
  return { bytes, filename: `${cert.number}-letter.pdf` }
}

/** Revokes a valid or superseded certificate; its certified pieces go back to approved. */
export async function revokeCertificate(db: Database, member: Member, id: string, reason: string) {
  return db.transaction(async (tx) => {
    const [cert] = await tx.select().from(certificates)
      .where(and(eq(certificates.id, id), eq(certificates.workshopId, member.workshopId))).for('update')
    if (!cert) fail(404, 'No such certificate in this workshop.')
    if (cert.status === 'revoked') fail(409, 'This certificate is already revoked.')
    const now = new Date()
    await tx.update(certificates).set({ status: 'revoked', revokedReason: reason, revokedAt: now, revokedBy: member.userId }).where(eq(certificates.id, id))
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

/** Queues the certificate e-mail to the buyer (or another address); a background job sends it. */
export async function sendCertificate(db: Database, member: Member, id: string, to: string | undefined) {
  return db.transaction(async (tx) => {
    const cert = await findCertificate(tx, member.workshopId, id)
    if (cert.status === 'revoked') fail(409, 'A revoked certificate cannot be sent.')
    const content = cert.content as unknown as CertificateContent
    const address = to ?? content.buyer.email
    const mail = certificateMail(content, cert.status)
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

const UNKNOWN_HASH = createHash('sha256').update('no such certificate').digest('hex')

function hashMatches(stored: string, recomputed: string) {
  const a = Buffer.from(stored.padEnd(64, '0').slice(0, 64), 'hex')
  const b = Buffer.from(recomputed, 'hex')
  return a.length === b.length && timingSafeEqual(a, b) && stored.length === recomputed.length
}

/**
 * The public answer for a verification code. Unknown codes do the same work (a
 * lookup and a hash over a stand-in) so the time taken does not tell them apart.
 */
export async function verifyCertificate(db: Executor, code: string) {
  const [row] = await db.select({ cert: certificates }).from(certificates).where(eq(certificates.code, code)).limit(1)
  if (!row) {
    hashContent({ code, UNKNOWN_HASH })
    return null
  }
  const cert = row.cert
  const content = cert.content as unknown as CertificateContent
  const recomputed = hashContent(content)
  const [superseding] = cert.supersededById
    ? await db.select({ number: certificates.number, code: certificates.code }).from(certificates).where(eq(certificates.id, cert.supersededById))
    : []
  return {
    status: cert.status,
    number: cert.number,
    signedAt: cert.signedAt,
    signerName: cert.signerName,
    workshop: { name: content.workshop?.name ?? '' },
    buyerOrganisation: content.buyer?.organisation || content.buyer?.name || '',
    instrument: content.instrument,
    referenceHz: content.referenceHz,
    temperament: content.temperament,
    conditions: { temperatureC: content.conditions?.temperatureC ?? null, humidityPct: content.conditions?.humidityPct ?? null },
    pieces: (content.pieces ?? []).map(p => ({
      position: p.position, note: p.note, targetHz: p.targetHz, verdict: p.verdict,
      worstCents: p.partials.reduce<number | null>((w, q) => (q.cents !== null && (w === null || Math.abs(q.cents) > Math.abs(w)) ? q.cents : w), null),
      partials: p.partials.map(q => ({ label: q.label, cents: q.cents, toleranceCents: q.toleranceCents, within: q.within, missing: q.missing, required: q.required })),
    })),
    hash: cert.contentHash,
    hashMatches: hashMatches(cert.contentHash, recomputed),
    revokedReason: cert.revokedReason,
    revokedAt: cert.revokedAt,
    supersededBy: superseding ? { number: superseding.number, code: superseding.code } : null,
  }
}
