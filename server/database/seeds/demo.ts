import { eq } from 'drizzle-orm'
import type { Database } from '../client'
import { memberships, users, workshops } from '../schema'
import { findUserByEmail } from '../../utils/accounts'
import { hashPassword } from '../../utils/passwords'
import type { BlobStorage } from '../../utils/storage'
import { addStarterTemplates } from '../../utils/templates'
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_WORKSHOP } from './demo-people'
import { seedCertifiedSet } from './demo-certified'
import { seedDemoRecords } from './demo-records'

/**
 * The demo workshop, its four people and its records, with one set already certified and
 * e-mailed (its certificate links to `siteUrl`/verify/<code>).
 */
export async function seedDemo(db: Database, storage: BlobStorage, siteUrl: string) {
  const owner = DEMO_PEOPLE[0]!
  if (await findUserByEmail(db, owner.email)) return { created: false, workshopName: DEMO_WORKSHOP.name }
  const passwordHash = await hashPassword(DEMO_PASSWORD)
  // One transaction: a failed seed leaves nothing behind and runs again next start.
  await db.transaction(async (tx) => {
    const [workshop] = await tx.insert(workshops).values(DEMO_WORKSHOP).returning()
    for (const person of DEMO_PEOPLE) {
      const [user] = await tx.insert(users).values({ email: person.email, name: person.name, passwordHash }).returning()
      await tx.insert(memberships).values({ workshopId: workshop!.id, userId: user!.id, role: person.role })
    }
    const [ownerRow] = await tx.select({ id: users.id }).from(users).where(eq(users.email, owner.email))
    await addStarterTemplates(tx, workshop!.id, ownerRow!.id)
    // Drizzle transactions nest (savepoints), so the services' own transactions run inside this one.
    const people = await seedDemoRecords(tx, storage, workshop!.id)
    await seedCertifiedSet(tx, storage, workshop!.id, people, siteUrl)
  })
  return { created: true, workshopName: DEMO_WORKSHOP.name }
}
