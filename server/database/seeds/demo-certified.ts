import { eq, sql } from 'drizzle-orm'
import type { Transaction } from '../client'
import { workshops } from '../schema'
import type { Member } from '../../utils/auth'
import { sendCertificate, signCertificate } from '../../utils/certificates'
import { createSet } from '../../utils/sets'
import type { BlobStorage } from '../../utils/storage'
import type { Role } from '../../../shared/auth/roles'
import { benchInputCalibration } from './demo-calibrations'
import { seedSetStrikes, type People } from './demo-records'

/** The demo's finished instrument (invented school and buyer): signed, e-mailed, verifiable. */
export const DEMO_CERTIFIED_SET = {
  name: 'Soprano glockenspiel for Harrowmere Primary', model: 'Brackenfold SG-1 (1 octave)', serial: 'SG1-0008',
  buyer: { name: 'Wren Astley', organisation: 'Harrowmere Primary School', email: 'music@harrowmere.test' },
  fromNote: 'C6', toNote: 'C7',
} as const

async function seedMember(db: Transaction, workshopId: string, userId: string, role: Role): Promise<Member> {
  const [row] = await db.execute<{ email: string, name: string, workshop: string }>(sql`
    select u.email, u.name, w.name as workshop from users u, workshops w where u.id = ${userId} and w.id = ${workshopId}`)
  return { sessionId: 'seed', userId, email: row!.email, name: row!.name, mustChangePassword: false, workshopId, workshopName: row!.workshop, role }
}

/**
 * A small diatonic glockenspiel, every bar struck and approved, then signed and e-mailed
 * through the same services the screens use: the certificate is frozen and hashed like any
 * other, its PDF job renders it after start and the outbox sends it once the PDF is stored.
 */
export async function seedCertifiedSet(db: Transaction, storage: BlobStorage, workshopId: string, people: People, siteUrl: string) {
  const [glock] = await db.execute<{ id: string }>(sql`select id from ratio_templates where workshop_id = ${workshopId} and name = 'Glockenspiel bar (fundamental)'`)
  if (!glock) throw new Error('Starter template "Glockenspiel bar (fundamental)" is missing.')
  const [workshop] = await db.select({ referenceHz: workshops.referenceHz }).from(workshops).where(eq(workshops.id, workshopId))
  const set = await createSet(db, workshopId, people.office, {
    ...DEMO_CERTIFIED_SET, buyer: { ...DEMO_CERTIFIED_SET.buyer },
    referenceHz: workshop!.referenceHz, temperament: 'equal', noteOffsetsCents: {}, chromatic: false,
    templateId: glock.id, registers: [], dueOn: '2026-11-20',
  })
  await seedSetStrikes(db, storage, workshopId, set.id, people, () => 'approved', 53, 0.5, await benchInputCalibration(db, workshopId))
  const signed = await signCertificate(db, await seedMember(db, workshopId, people.supervisor, 'supervisor'), set.id, siteUrl)
  await sendCertificate(db, await seedMember(db, workshopId, people.office, 'office'), signed.id, undefined)
  return { setId: set.id, certificate: signed }
}
