import { and, count, eq, gt } from 'drizzle-orm'
import { loginAttempts } from '../database/schema'
import type { Executor } from '../database/client'

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

export async function recordFailedSignIn(db: Executor, ip: string, email: string) {
  await db.insert(loginAttempts).values({ ip, email })
}

export async function clearFailedSignIns(db: Executor, email: string) {
  await db.delete(loginAttempts).where(eq(loginAttempts.email, email))
}
