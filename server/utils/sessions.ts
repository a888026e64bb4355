import { createHmac, randomBytes } from 'node:crypto'
import { and, eq, gt, lt, sql } from 'drizzle-orm'
import { memberships, sessions, users, workshops } from '../database/schema'
import type { Executor } from '../database/client'
import type { Role } from '../../shared/auth/roles'

export function newToken(): string {
  return randomBytes(32).toString('base64url')
}

/** Tokens are stored only as an HMAC under the server's secret. */
export function hashToken(token: string, secret: string): string {
  return createHmac('sha256', secret).update(token).digest('base64url')
}

export async function createSession(db: Executor, input: { userId: string, workshopId: string | null, secret: string, maxAgeS: number }) {
  const token = newToken()
  await db.insert(sessions).values({
    tokenHash: hashToken(token, input.secret),
    userId: input.userId,
    workshopId: input.workshopId,
    expiresAt: new Date(Date.now() + input.maxAgeS * 1000),
  })
  // Opportunistic clean-up keeps the table small without a scheduler.
  await db.delete(sessions).where(and(eq(sessions.userId, input.userId), lt(sessions.expiresAt, new Date())))
  return token
}

export interface SessionMember {
  sessionId: string
  userId: string
  email: string
  name: string
  mustChangePassword: boolean
  workshopId: string | null
  workshopName: string | null
  role: Role | null
}

/** The session lookup of every request, built once per database with placeholders. */
function sessionMemberQuery(db: Executor) {
  // The X-Workshop-Id override when given, else the session's current workshop.
  const workshopId = sql`coalesce(${sql.placeholder('workshopOverride')}::uuid, ${sessions.workshopId})`
  return db
    .select({
      sessionId: sessions.id, userId: users.id, email: users.email, name: users.name,
      mustChangePassword: users.mustChangePassword, workshopId: sql<string | null>`${workshopId}`,
      workshopName: workshops.name, role: memberships.role,
    })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .leftJoin(memberships, and(eq(memberships.userId, users.id), sql`${memberships.workshopId} = ${workshopId}`))
    .leftJoin(workshops, eq(workshops.id, memberships.workshopId))
    .where(and(eq(sessions.tokenHash, sql.placeholder('tokenHash')), gt(sessions.expiresAt, sql.placeholder('now'))))
    .limit(1)
    // A named statement: PostgreSQL parses and plans it once per connection, not on every request.
    .prepare('session_member')
}

const preparedLookups = new WeakMap<Executor, ReturnType<typeof sessionMemberQuery>>()

/**
 * The signed-in user behind a token, with the workshop they act in: the session's
 * current one, or `workshopOverride` (e.g. an X-Workshop-Id header) when given.
 * A workshop the user is not a member of gives role null.
 */
export async function findSessionMember(db: Executor, token: string, secret: string, workshopOverride?: string): Promise<SessionMember | null> {
  // One round trip per request: session, user and (when there is one) the membership.
  let lookup = preparedLookups.get(db)
  if (!lookup) preparedLookups.set(db, lookup = sessionMemberQuery(db))
  const [row] = await lookup.execute({ tokenHash: hashToken(token, secret), workshopOverride: workshopOverride ?? null, now: new Date().toISOString() })
  if (!row) return null
  return { ...row, workshopName: row.workshopName ?? null, role: row.role ?? null }
}

export async function deleteSession(db: Executor, token: string, secret: string) {
  await db.delete(sessions).where(eq(sessions.tokenHash, hashToken(token, secret)))
}

export async function listUserWorkshops(db: Executor, userId: string) {
  return db
    .select({ id: workshops.id, name: workshops.name, role: memberships.role })
    .from(memberships)
    .innerJoin(workshops, eq(workshops.id, memberships.workshopId))
    .where(eq(memberships.userId, userId))
    .orderBy(workshops.name)
}

export async function switchSessionWorkshop(db: Executor, sessionId: string, userId: string, workshopId: string): Promise<boolean> {
  const [member] = await db.select({ id: memberships.id }).from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.workshopId, workshopId))).limit(1)
  if (!member) return false
  await db.update(sessions).set({ workshopId }).where(eq(sessions.id, sessionId))
  return true
}
