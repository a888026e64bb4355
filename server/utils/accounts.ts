import { and, eq, sql } from 'drizzle-orm'
import { memberships, users, workshops } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { Role } from '../../shared/auth/roles'
import { audit } from './audit'
import { conflictOnDuplicate, fail } from './http-errors'
import { checkPassword, hashPassword } from './passwords'

export async function findUserByEmail(db: Executor, email: string) {
  const [user] = await db.select().from(users).where(sql`lower(${users.email}) = ${email.toLowerCase()}`).limit(1)
  return user ?? null
}

/** The user for these credentials, or null (same answer for a wrong password and an unknown e-mail). */
export async function verifyCredentials(db: Executor, email: string, password: string) {
  const user = await findUserByEmail(db, email)
  const ok = await checkPassword(password, user?.passwordHash)
  return ok ? user : null
}

export async function firstWorkshopOf(db: Executor, userId: string): Promise<string | null> {
  const [row] = await db.select({ id: memberships.workshopId }).from(memberships)
    .where(eq(memberships.userId, userId)).orderBy(memberships.createdAt).limit(1)
  return row?.id ?? null
}

const SIGN_UP_TAKEN = 'That e-mail address cannot be used to sign up. If you already have an account, sign in and add a workshop from the workshop menu.'

/**
 * Sign-up: a new user and a new workshop they own, in one transaction. `onCreated`
 * runs inside it, so the workshop's starter data lands with it or not at all.
 */
export async function signUp(
  db: Database,
  input: { name: string, email: string, password: string, workshopName: string },
  onCreated?: (tx: Executor, workshopId: string, userId: string) => Promise<void>,
) {
  const passwordHash = await hashPassword(input.password)
  return conflictOnDuplicate(() => db.transaction(async (tx) => {
    const existing = await findUserByEmail(tx, input.email)
    if (existing) fail(409, SIGN_UP_TAKEN)
    const [user] = await tx.insert(users).values({ name: input.name, email: input.email, passwordHash }).returning()
    const workshop = await createWorkshopFor(tx, user!.id, input.workshopName, onCreated)
    return { user: user!, workshop }
  }), SIGN_UP_TAKEN, 'users_email_key')
}

/** A workshop owned by an existing user. */
export async function createWorkshopFor(
  tx: Executor,
  userId: string,
  name: string,
  onCreated?: (tx: Executor, workshopId: string, userId: string) => Promise<void>,
) {
  const [workshop] = await tx.insert(workshops).values({ name }).returning()
  await tx.insert(memberships).values({ workshopId: workshop!.id, userId, role: 'owner' })
  await audit(tx, { workshopId: workshop!.id, actorId: userId, action: 'workshop.create', subjectType: 'workshop', subjectId: workshop!.id, toState: 'owner' })
  if (onCreated) await onCreated(tx, workshop!.id, userId)
  return workshop!
}

export async function membershipOf(db: Executor, workshopId: string, userId: string): Promise<Role | null> {
  const [row] = await db.select({ role: memberships.role }).from(memberships)
    .where(and(eq(memberships.workshopId, workshopId), eq(memberships.userId, userId))).limit(1)
  return row?.role ?? null
}
