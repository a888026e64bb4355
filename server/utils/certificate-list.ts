import { and, desc, eq, ilike, inArray, or, sql, type SQL } from 'drizzle-orm'
import { alias, type AnyPgColumn } from 'drizzle-orm/pg-core'
import { certificates, mailMessages, sets } from '../database/schema'
import type { Executor } from '../database/client'
import { certificateChanges, readHeading } from '../../shared/certificates/contentChanges'

/** What the list shows of a certificate's own frozen content: a later edit of the set never changes it. */
const headingOf = (content: AnyPgColumn) => sql<unknown>`case when ${content} is null then null else jsonb_build_object(
  'buyer', ${content}->'buyer',
  'instrument', jsonb_build_object('name', ${content}->'instrument'->'name', 'model', ${content}->'instrument'->'model', 'serial', ${content}->'instrument'->'serial')) end`

/** `%q%` for ILIKE with the user's own % and _ taken literally. */
const likePattern = (q: string) => `%${q.replace(/[\\%_]/g, c => `\\${c}`)}%`

/** A search over the certificate number, the frozen buyer and serial, and the set's current serial and buyer. */
function searchOf(q: string): SQL | undefined {
  const pattern = likePattern(q)
  return or(
    ilike(certificates.number, pattern),
    ilike(sets.serial, pattern),
    ilike(sets.buyerName, pattern),
    ilike(sets.buyerOrganisation, pattern),
    sql`${certificates.content}->'instrument'->>'serial' ilike ${pattern}`,
    sql`${certificates.content}->'buyer'->>'name' ilike ${pattern}`,
    sql`${certificates.content}->'buyer'->>'organisation' ilike ${pattern}`,
    sql`${certificates.content}->'buyer'->>'email' ilike ${pattern}`,
  )
}

/** The workshop's certificates, newest first, with their set, what each froze, its changes against the one it superseded, and its mail. */
export async function listCertificates(db: Executor, workshopId: string, filter: { set?: string, q?: string } = {}) {
  const previous = alias(certificates, 'previous')
  const rows = await db.select({
    id: certificates.id, number: certificates.number, code: certificates.code, status: certificates.status,
    setId: certificates.setId, setName: sets.name, liveSerial: sets.serial,
    heading: headingOf(certificates.content), previousHeading: headingOf(previous.content),
    signerName: certificates.signerName, signedAt: certificates.signedAt, contentHash: certificates.contentHash,
    supersedesId: certificates.supersedesId, supersededById: certificates.supersededById,
    revokedReason: certificates.revokedReason, revokedAt: certificates.revokedAt, pdfStatus: certificates.pdfStatus,
    reissueReason: certificates.reissueReason,
  }).from(certificates).innerJoin(sets, eq(sets.id, certificates.setId))
    .leftJoin(previous, eq(previous.id, certificates.supersedesId))
    .where(and(
      eq(certificates.workshopId, workshopId),
      filter.set ? eq(certificates.setId, filter.set) : undefined,
      filter.q ? searchOf(filter.q) : undefined,
    ))
    .orderBy(desc(certificates.signedAt))
    .limit(500)
  const ids = rows.map(r => r.id)
  const mails = ids.length
    ? await db.select({ certificateId: mailMessages.certificateId, id: mailMessages.id, to: mailMessages.to, status: mailMessages.status, attempts: mailMessages.attempts, lastError: mailMessages.lastError, createdAt: mailMessages.createdAt, sentAt: mailMessages.sentAt })
        .from(mailMessages).where(and(eq(mailMessages.workshopId, workshopId), inArray(mailMessages.certificateId, ids))).orderBy(desc(mailMessages.createdAt))
    : []
  return rows.map(({ heading: storedHeading, previousHeading: storedPrevious, ...r }) => {
    const heading = readHeading(storedHeading)
    const previousHeading = readHeading(storedPrevious)
    return {
      ...r,
      setSerial: heading?.instrument.serial ?? r.liveSerial,
      model: heading?.instrument.model ?? '',
      buyerName: heading?.buyer.name ?? '',
      buyerOrganisation: heading?.buyer.organisation ?? '',
      buyerEmail: heading?.buyer.email ?? '',
      changes: heading && previousHeading ? certificateChanges(previousHeading, heading) : [],
      mails: mails.filter(m => m.certificateId === r.id),
    }
  })
}
