import type { H3Event } from 'h3'
import { getRequestIP } from 'h3'
import type { SignInInput } from '../../shared/schemas/auth'
import { firstWorkshopOf, verifyCredentials } from './accounts'
import { fail } from './http-errors'
import { clearFailedSignIns, DEFAULT_SIGN_IN_LIMITS, isSignInBlocked, recordFailedSignIn } from './rate-limit'
import { createSession } from './sessions'

const WRONG = 'That e-mail and password do not match an account.'
const SLOW_DOWN = 'Too many sign-in attempts. Wait 15 minutes and try again.'

/** The limits in force: the per-address count can be raised by runtime config (the tests do). */
function signInLimits() {
  const perAddress = Number(useRuntimeConfig().signInMaxPerAddress)
  return { ...DEFAULT_SIGN_IN_LIMITS, maxPerAddress: perAddress || DEFAULT_SIGN_IN_LIMITS.maxPerAddress }
}

/** Checks the credentials (rate-limited per address and per account) and opens a session. */
export async function signIn(event: H3Event, input: SignInInput): Promise<{ token: string }> {
  const db = useDatabase()
  const config = useRuntimeConfig()
  const ip = getRequestIP(event) ?? 'unknown'
  if (await isSignInBlocked(db, ip, input.email, signInLimits())) fail(429, SLOW_DOWN)
  const user = await verifyCredentials(db, input.email, input.password)
  if (!user) {
    await recordFailedSignIn(db, ip, input.email)
    fail(401, WRONG)
  }
  await clearFailedSignIns(db, input.email)
  const workshopId = await firstWorkshopOf(db, user.id)
  const token = await createSession(db, { userId: user.id, workshopId, secret: config.authSecret, maxAgeS: Number(config.sessionMaxAgeS) })
  return { token }
}

/**
 * Reset requests share the sign-in counters (kept per "reset:" + e-mail and per
 * address), so one address cannot send requests without end; known and unknown
 * e-mails are limited alike.
 */
export async function limitResetRequests(event: H3Event, email: string) {
  const db = useDatabase()
  const ip = getRequestIP(event) ?? 'unknown'
  const key = `reset:${email}`
  if (await isSignInBlocked(db, ip, key, signInLimits())) fail(429, 'Too many requests from here. Wait 15 minutes and try again.')
  await recordFailedSignIn(db, ip, key)
}
