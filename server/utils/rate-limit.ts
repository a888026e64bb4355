import { and, count, eq, gt, sql } from 'drizzle-orm'
import { loginAttempts } from '../database/schema'
import type { Database, Executor } from '../database/client'

export interface SignInLimits {
  windowS: number
  maxPerAddress: number
  maxPerAccount: number
}

export const DEFAULT_SIGN_IN_LIMITS: SignInLimits = { windowS: 15 * 60, maxPerAddress: 30, maxPerAccount: 8 }

/**
 * Failed sign-ins are counted in PostgreSQL (not in a process) so that every app
 * instance sees the same count. Returns true when this address or this account
 * (known or not: the count is kept per e-mail string) has failed too often.
 */
export async function isSignInBlocked(db: Executor, ip: string, email: string, limits = DEFAULT_SIGN_IN_LIMITS): Promise<boolean> {
  const since = new Date(Date.now() - limits.windowS * 1000)
  const [[byAddress], [byAccount]] = await Promise.all([
    db.select({ n: count() }).from(loginAttempts).where(and(eq(loginAttempts.ip, ip), gt(loginAttempts.at, since))),
    db.select({ n: count() }).from(loginAttempts).where(and(eq(loginAttempts.email, email), gt(loginAttempts.at, since))),
  ])
  return (byAddress?.n ?? 0) >= limits.maxPerAddress || (byAccount?.n ?? 0) >= limits.maxPerAccount
}

// Namespaces of the two advisory locks (pg_advisory_xact_lock(int, int)), so an address never shares a lock with a key.
const ADDRESS_LOCK = 7101
const KEY_LOCK = 7102

/**
 * Counts and decides in one transaction under advisory locks on the address and
 * the key, and when allowed records the attempt at once (a failure until
 * `releaseAttempt`). So parallel requests queue for the count: ten simultaneous
 * wrong passwords for one e-mail get at most `maxPerAccount` tries. The locks are
 * held for the count and the insert only, not while the password is checked.
 * Returns the attempt's id, or null when the limit is reached.
 */
export async function reserveAttempt(db: Database, ip: string, key: string, limits = DEFAULT_SIGN_IN_LIMITS): Promise<string | null> {
  return db.transaction(async (tx) => {
    // Always the address first, then the key: two requests never wait on each other in a cycle.
    await tx.execute(sql`select pg_advisory_xact_lock(${ADDRESS_LOCK}::int, hashtext(${ip}))`)
    await tx.execute(sql`select pg_advisory_xact_lock(${KEY_LOCK}::int, hashtext(${key}))`)
    if (await isSignInBlocked(tx, ip, key, limits)) return null
    const [row] = await tx.insert(loginAttempts).values({ ip, email: key }).returning({ id: loginAttempts.id })
    return row!.id
  })
}

/** Forgets a reserved attempt that succeeded. */
export async function releaseAttempt(db: Executor, id: string) {
  await db.delete(loginAttempts).where(eq(loginAttempts.id, id))
}

export async function recordFailedSignIn(db: Executor, ip: string, email: string) {
  await db.insert(loginAttempts).values({ ip, email })
}

export async function clearFailedSignIns(db: Executor, email: string) {
  await db.delete(loginAttempts).where(eq(loginAttempts.email, email))
}
