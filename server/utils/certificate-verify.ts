import { createHash, timingSafeEqual } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { certificates } from '../database/schema'
import type { Executor } from '../database/client'
import { CertificateContentSchema } from '../../shared/schemas/certificateContent'
import { hashContent } from './certificate-freeze'

const UNKNOWN_HASH = createHash('sha256').update('no such certificate').digest('hex')
const UNREADABLE_INSTRUMENT = { name: '', model: '', serial: '', range: '', pieceCount: 0, scrappedCount: 0, lots: [] }

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
  // The hash covers the content as stored; the parsed copy is only for display. Content
  // that does not read as a certificate at all has been altered: it is shown empty and fails.
  const recomputed = hashContent(cert.content)
  const parsed = CertificateContentSchema.safeParse(cert.content)
  const content = parsed.success ? parsed.data : null
  const [superseding] = cert.supersededById
    ? await db.select({ number: certificates.number, code: certificates.code }).from(certificates).where(eq(certificates.id, cert.supersededById))
    : []
  return {
    status: cert.status,
    number: cert.number,
    signedAt: cert.signedAt,
    signerName: cert.signerName,
    workshop: { name: content?.workshop.name ?? '' },
    buyerOrganisation: content?.buyer.organisation || content?.buyer.name || '',
    instrument: content?.instrument ?? UNREADABLE_INSTRUMENT,
    referenceHz: content?.referenceHz ?? null,
    temperament: content?.temperament ?? '',
    conditions: { temperatureC: content?.conditions.temperatureC ?? null, humidityPct: content?.conditions.humidityPct ?? null },
    pieces: (content?.pieces ?? []).map(p => ({
      position: p.position, note: p.note, targetHz: p.targetHz, verdict: p.verdict,
      worstCents: p.partials.reduce<number | null>((w, q) => (q.cents !== null && (w === null || Math.abs(q.cents) > Math.abs(w)) ? q.cents : w), null),
      partials: p.partials.map(q => ({ label: q.label, cents: q.cents, expandedUncertaintyCents: q.expandedUncertaintyCents, toleranceCents: q.toleranceCents, within: q.within, missing: q.missing, required: q.required })),
    })),
    hash: cert.contentHash,
    hashMatches: parsed.success && hashMatches(cert.contentHash, recomputed),
    revokedReason: cert.revokedReason,
    revokedAt: cert.revokedAt,
    supersededBy: superseding ? { number: superseding.number, code: superseding.code } : null,
  }
}
