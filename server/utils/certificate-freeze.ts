import { createHash, randomBytes } from 'node:crypto'
import { and, asc, desc, eq, inArray, like, sql } from 'drizzle-orm'
import {
  certificates, lots, pieces, reviews, sets, strikes, templateVersions, workshops, type Certificate,
} from '../database/schema'
import type { Executor } from '../database/client'
import { ROLE_LABELS } from '../../shared/auth/roles'
import { canonicalJson } from '../../shared/certificates/canonicalJson'
import { buildCertificateContent, type CertificateContent } from '../../shared/certificates/content'
import { isFinished } from '../../shared/records/stages'
import { parseStoredAnalysis } from '../../shared/schemas/analysis'
import type { Member } from './auth'
import { approvalPending } from './approval-window'
import { fail } from './http-errors'
import { budgetAtStrike } from './piece-budget'

/** A re-issue names the valid certificate it replaces and says why. */
export interface Reissue { id: string, reason: string }

/** What the freeze step hands to the store step: the content and the facts the rows need. */
export interface FrozenCertificate {
  content: CertificateContent
  contentHash: string
  number: string
  code: string
  signedAt: Date
  previous: Certificate | null
  pieceCount: number
}

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

/** TW-<year>-<4-digit serial>, counted per workshop and year. */
export function certificateNumber(year: number, serial: number) {
  return `TW-${year}-${String(serial).padStart(4, '0')}`
}

async function nextNumber(tx: Executor, workshopId: string, year: number) {
  const prefix = `TW-${year}-`
  const [row] = await tx.select({ n: sql<number>`coalesce(max(split_part(${certificates.number}, '-', 3)::int), 0)` })
    .from(certificates).where(and(eq(certificates.workshopId, workshopId), like(certificates.number, `${prefix}%`)))
  return certificateNumber(year, (row?.n ?? 0) + 1)
}

/**
 * Why this signing may not go on, or null: a re-issue must name the set's current
 * valid certificate; a first signing must find none.
 */
export function supersessionProblem(
  previous: { id: string, number: string } | null,
  reissue: Reissue | null,
  named: { status: string, number: string } | null,
): string | null {
  if (!reissue) return previous ? `This set already has a valid certificate (${previous.number}). To replace it, re-issue that certificate with a reason.` : null
  if (previous && previous.id === reissue.id) return null
  return named?.status === 'revoked'
    ? `Certificate ${named.number} is revoked and cannot be re-issued; sign the set again instead.`
    : `Certificate ${named?.number ?? ''} has already been superseded${previous ? ` by ${previous.number}` : ''}; re-issue the current one.`
}

/** Why these live pieces cannot be certified yet, or null. */
export function readinessProblem(live: { note: string, stage: string, approvedStrikeId: string | null, approvalPending?: boolean }[]): string | null {
  const notReady = live.filter(p => !isFinished(p.stage))
  if (live.length === 0) return 'This set has no pieces to certify.'
  if (notReady.length) {
    const names = notReady.slice(0, 5).map(p => p.note).join(', ')
    return `Not every piece is approved yet (${notReady.length} left: ${names}${notReady.length > 5 ? ', …' : ''}).`
  }
  if (live.some(p => !p.approvedStrikeId)) return 'A piece has no approved strike; reopen and approve it again.'
  // A pending approval can still be undone: signing waits until it is final.
  const pending = live.filter(p => p.approvalPending)
  if (pending.length) {
    return `${pending.map(p => p.note).slice(0, 5).join(', ')}${pending.length > 5 ? ', …' : ''} ${pending.length === 1 ? 'was' : 'were'} approved moments ago and can still be undone; sign in a few seconds.`
  }
  return null
}

/** The latest approving review's override reason per strike, from reviews newest first. */
export function latestOverrideByStrike(overrides: { strikeId: string | null, reason: string | null }[]) {
  const byStrike = new Map<string, string | null>()
  for (const o of overrides) if (o.strikeId && !byStrike.has(o.strikeId)) byStrike.set(o.strikeId, o.reason)
  return byStrike
}

/** Locks the workshop (numbering), the set (signing) and its valid certificate, and checks the signing may go on. */
async function lockForSigning(tx: Executor, workshopId: string, setId: string, reissue: Reissue | null) {
  // The workshop row lock serialises numbering within a workshop; the set row lock serialises signing of one set.
  const [workshop] = await tx.select().from(workshops).where(eq(workshops.id, workshopId)).for('update')
  const [set] = await tx.select().from(sets).where(and(eq(sets.id, setId), eq(sets.workshopId, workshopId))).for('update')
  if (!workshop || !set) fail(404, 'No such set in this workshop.')
  const [previous] = await tx.select().from(certificates)
    .where(and(eq(certificates.setId, setId), eq(certificates.status, 'valid'))).for('update')
  const [named] = reissue && previous?.id !== reissue.id
    ? await tx.select({ status: certificates.status, number: certificates.number }).from(certificates).where(eq(certificates.id, reissue.id))
    : []
  const problem = supersessionProblem(previous ?? null, reissue, named ?? null)
  if (problem) fail(409, problem)
  return { workshop, set, previous: previous ?? null }
}

/** The set's pieces (locked) with their template versions, the live ones checked ready, and their approved strikes. */
async function readApprovedPieces(tx: Executor, workshopId: string, setId: string) {
  const rows = await tx.select({ piece: pieces, template: templateVersions, approvalPending: approvalPending() }).from(pieces)
    .innerJoin(templateVersions, eq(templateVersions.id, pieces.templateVersionId))
    .where(eq(pieces.setId, setId)).orderBy(asc(pieces.position)).for('update', { of: pieces })
  const live = rows.filter(r => r.piece.stage !== 'scrapped')
  const problem = readinessProblem(live.map(r => ({ ...r.piece, approvalPending: r.approvalPending })))
  if (problem) fail(409, problem)
  const strikeIds = live.map(r => r.piece.approvedStrikeId!)
  const strikeRows = await tx.select().from(strikes).where(and(inArray(strikes.id, strikeIds), eq(strikes.workshopId, workshopId)))
  const overrides = await tx.select({ strikeId: reviews.strikeId, reason: reviews.overrideReason }).from(reviews)
    .where(and(inArray(reviews.strikeId, strikeIds), eq(reviews.decision, 'approve'))).orderBy(desc(reviews.createdAt))
  return {
    live, scrappedCount: rows.length - live.length,
    strikeById: new Map(strikeRows.map(s => [s.id, s])), overrideByStrike: latestOverrideByStrike(overrides),
  }
}

/**
 * Freeze: reads and validates the set's approved pieces and builds the certificate
 * content, inside the caller's transaction (the locks hold until it ends).
 */
export async function freezeCertificate(tx: Executor, member: Member, setId: string, siteUrl: string, reissue: Reissue | null): Promise<FrozenCertificate> {
  const { workshop, set, previous } = await lockForSigning(tx, member.workshopId, setId, reissue)
  const { live, scrappedCount, strikeById, overrideByStrike } = await readApprovedPieces(tx, member.workshopId, setId)
  const lotRows = await tx.select().from(lots).where(eq(lots.workshopId, member.workshopId))

  const signedAt = new Date()
  const number = await nextNumber(tx, member.workshopId, signedAt.getUTCFullYear())
  const code = newVerificationCode()
  // Each piece's budget is frozen with the certificate, so verification and re-renders never change it.
  const budgets = new Map<string, Awaited<ReturnType<typeof budgetAtStrike>>>()
  for (const { piece, template } of live) {
    const strike = strikeById.get(piece.approvedStrikeId!)
    if (strike) budgets.set(piece.id, await budgetAtStrike(tx, member.workshopId, piece.id, strike, template, workshop.calibrationValidDays))
  }
  const content = buildCertificateContent({
    number, verificationUrl: verificationUrl(siteUrl, code), supersedes: previous?.number ?? null, signedAt,
    signer: { name: member.name, role: ROLE_LABELS[member.role] },
    workshop: { name: workshop.name, address: workshop.address },
    set, scrappedCount, lots: lotRows,
    pieces: live.map(({ piece, template }) => {
      const strike = strikeById.get(piece.approvedStrikeId!)
      if (!strike) fail(409, `The approved strike of ${piece.note} is missing.`)
      const analysis = parseStoredAnalysis(strike.analysis)
      return {
        position: piece.position, note: piece.note, targetHz: piece.targetHz, lotId: piece.lotId, template,
        strike: { temperatureC: strike.temperatureC, humidityPct: strike.humidityPct, verdict: strike.verdict, engineVersion: strike.engineVersion, matches: analysis.matches ?? [], partials: analysis.partials },
        overrideReason: overrideByStrike.get(strike.id) ?? null,
        budget: budgets.get(piece.id),
      }
    }),
  })
  return { content, contentHash: hashContent(content), number, code, signedAt, previous, pieceCount: live.length }
}
