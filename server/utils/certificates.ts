import { createHash, randomBytes } from 'node:crypto'
import { and, asc, desc, eq, inArray, like, sql } from 'drizzle-orm'
import {
  certificates, lots, pieces, reviews, sets, strikes, templateVersions, workshops, type Certificate,
} from '../database/schema'
import type { Database, Executor } from '../database/client'
import { ROLE_LABELS } from '../../shared/auth/roles'
import { isFinished } from '../../shared/records/stages'
import { canonicalJson } from '../../shared/certificates/canonicalJson'
import { buildCertificateContent } from '../../shared/certificates/content'
import { parseStoredAnalysis } from '../../shared/schemas/analysis'
import { parseCertificateContent } from '../../shared/schemas/certificateContent'
import type { Member } from './auth'
import { audit } from './audit'
import type { Paper } from './certificate-pdf'
import { PDF_PENDING, certificatePdfKey } from './certificate-pdf-job'
import { renderPdfOffThread } from './certificate-pdf-pool'
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

/** Postgres' unique-violation code, and the index that allows one valid certificate per set. */
const UNIQUE_VIOLATION = '23505'
const ONE_VALID_PER_SET = 'certificates_set_valid_key'

function isOneValidViolation(error: unknown) {
  const e = error as { code?: string, constraint_name?: string, cause?: { code?: string, constraint_name?: string } }
  const pg = e?.code ? e : e?.cause
  return pg?.code === UNIQUE_VIOLATION && pg.constraint_name === ONE_VALID_PER_SET
}

/**
 * Signs the certificate of a set whose every live piece is approved: freezes the
 * content, hashes it and moves approved pieces to certified, in one transaction.
 * The PDF is rendered afterwards by a job (`pdf_status` is `pending` until then).
 * A set with a valid certificate is refused (409): replacing it is the separate,
 * explicit re-issue with a reason. Two signings racing meet at the set row lock,
 * and the one-valid-per-set index is the last word.
 */
export async function signCertificate(db: Database, member: Member, setId: string, siteUrl: string) {
  return issue(db, member, setId, siteUrl, null)
}

/** Re-issues a valid certificate: a new number from the set's current records supersedes it. */
export async function reissueCertificate(db: Database, member: Member, id: string, reason: string, siteUrl: string) {
  const cert = await findCertificate(db, member.workshopId, id)
  return issue(db, member, cert.setId, siteUrl, { id, reason })
}

async function issue(db: Database, member: Member, setId: string, siteUrl: string, reissue: { id: string, reason: string } | null) {
  try {
    return await db.transaction(tx => issueIn(tx, member, setId, siteUrl, reissue))
  }
  catch (error) {
    if (isOneValidViolation(error)) fail(409, 'This set was signed a moment ago by another request; its certificate is in the list.')
    throw error
  }
}

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]

async function issueIn(tx: Tx, member: Member, setId: string, siteUrl: string, reissue: { id: string, reason: string } | null) {
  // The workshop row lock serialises numbering within a workshop; the set row lock serialises signing of one set.
  const [workshop] = await tx.select().from(workshops).where(eq(workshops.id, member.workshopId)).for('update')
  const [set] = await tx.select().from(sets).where(and(eq(sets.id, setId), eq(sets.workshopId, member.workshopId))).for('update')
  if (!workshop || !set) fail(404, 'No such set in this workshop.')
  const [previous] = await tx.select().from(certificates)
    .where(and(eq(certificates.setId, setId), eq(certificates.status, 'valid'))).for('update')
  if (reissue) {
    if (!previous || previous.id !== reissue.id) {
      const [cert] = await tx.select({ status: certificates.status, number: certificates.number }).from(certificates).where(eq(certificates.id, reissue.id))
      fail(409, cert?.status === 'revoked'
        ? `Certificate ${cert.number} is revoked and cannot be re-issued; sign the set again instead.`
        : `Certificate ${cert?.number ?? ''} has already been superseded${previous ? ` by ${previous.number}` : ''}; re-issue the current one.`)
    }
  }
  else if (previous) {
    fail(409, `This set already has a valid certificate (${previous.number}). To replace it, re-issue that certificate with a reason.`)
  }
  const rows = await tx.select({ piece: pieces, template: templateVersions }).from(pieces)
    .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
    .where(eq(pieces.setId, setId)).orderBy(asc(pieces.position)).for('update', { of: pieces })
  const live = rows.filter(r => r.piece.stage !== 'scrapped')
  const notReady = live.filter(r => !isFinished(r.piece.stage))
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
      const analysis = parseStoredAnalysis(strike.analysis)
      return {
        position: piece.position, note: piece.note, targetHz: piece.targetHz, lotId: piece.lotId, template,
        strike: { temperatureC: strike.temperatureC, humidityPct: strike.humidityPct, verdict: strike.verdict, engineVersion: strike.engineVersion, matches: analysis.matches ?? [], partials: analysis.partials },
        overrideReason: overrideByStrike.get(strike.id) ?? null,
      }
    }),
  })
  const contentHash = hashContent(content)
  if (previous) {
    // First the old one stops being valid (the one-valid-per-set index), and its PDF is rendered again with its mark.
    await tx.update(certificates).set({ status: 'superseded', ...PDF_PENDING() }).where(eq(certificates.id, previous.id))
  }
  const [certificate] = await tx.insert(certificates).values({
    workshopId: member.workshopId, setId, number, code, content, contentHash,
    pdfKey: certificatePdfKey(member.workshopId, number, 'valid'), ...PDF_PENDING(),
    signerId: member.userId, signerName: member.name, signedAt, supersedesId: previous?.id ?? null, reissueReason: reissue?.reason ?? null,
  }).returning()
  if (previous) {
    await tx.update(certificates).set({ supersededById: certificate!.id }).where(eq(certificates.id, previous.id))
    await audit(tx, {
      workshopId: member.workshopId, actorId: member.userId, action: 'certificate.reissue', subjectType: 'certificate', subjectId: previous.id,
      fromState: 'valid', toState: 'superseded', reason: reissue?.reason ?? null, details: { number: previous.number, supersededBy: number },
    })
  }
  await tx.update(pieces).set({ stage: 'certified', updatedAt: signedAt })
    .where(and(eq(pieces.setId, setId), eq(pieces.stage, 'approved')))
  await audit(tx, {
    workshopId: member.workshopId, actorId: member.userId, action: 'certificate.sign', subjectType: 'certificate', subjectId: certificate!.id,
    toState: 'valid', reason: reissue?.reason ?? null, details: { number, setId, hash: contentHash, supersedes: previous?.number ?? null, pieces: live.length },
  })
  return { id: certificate!.id, number, code, pdfStatus: 'pending' as const }
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

/** Queues the certificate e-mail to the buyer (or another address); a background job sends it. */
export async function sendCertificate(db: Database, member: Member, id: string, to: string | undefined) {
  return db.transaction(async (tx) => {
    const cert = await findCertificate(tx, member.workshopId, id)
    if (cert.status === 'revoked') fail(409, 'A revoked certificate cannot be sent.')
    if (cert.status === 'superseded') {
      // Decided: a superseded certificate is never mailed; the buyer gets the current one, sent from its own row.
      const [current] = cert.supersededById ? await tx.select({ number: certificates.number }).from(certificates).where(eq(certificates.id, cert.supersededById)) : []
      fail(409, `Certificate ${cert.number} has been superseded${current ? ` by ${current.number}` : ''}; send the current certificate instead.`)
    }
    const content = parseCertificateContent(cert.content)
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
