import type { H3Event } from 'h3'
import type { SignInInput } from '../../shared/schemas/auth'
import { firstWorkshopOf, verifyCredentials } from './accounts'
import { clientAddress } from './client-address'
import { fail } from './http-errors'
import { clearFailedSignIns, DEFAULT_SIGN_IN_LIMITS, releaseAttempt, reserveAttempt } from './rate-limit'
import { createSession } from './sessions'

const WRONG = 'That e-mail and password do not match an account.'
const SLOW_DOWN = 'Too many sign-in attempts. Wait 15 minutes and try again.'

/** The limits in force: the per-address count can be raised by runtime config (the tests do). */
function signInLimits() {
  const perAddress = Number(useRuntimeConfig().signInMaxPerAddress)
  return { ...DEFAULT_SIGN_IN_LIMITS, maxPerAddress: perAddress || DEFAULT_SIGN_IN_LIMITS.maxPerAddress }
}

/**
 * Checks the credentials (rate-limited per address and per account) and opens a
 * session. The attempt is counted before the password is checked, under a lock
 * (reserveAttempt), so parallel guesses cannot slip past the limit.
 */
export async function signIn(event: H3Event, input: SignInInput): Promise<{ token: string }> {
  const db = useDatabase()
  const config = useRuntimeConfig()
  const attempt = await reserveAttempt(db, clientAddress(event), input.email, signInLimits())
  if (!attempt) fail(429, SLOW_DOWN)
  const user = await verifyCredentials(db, input.email, input.password)
  if (!user) fail(401, WRONG)
  // Success forgets this account's failures, the reserved attempt among them.
  await clearFailedSignIns(db, input.email)
  const workshopId = await firstWorkshopOf(db, user.id)
  const token = await createSession(db, { userId: user.id, workshopId, secret: config.authSecret, maxAgeS: Number(config.sessionMaxAgeS) })
  return { token }
}

/**
 * Reset requests share the sign-in counters (kept per "reset:" + e-mail and per
 * address), so one address cannot send requests without end; known and unknown
 * e-mails are limited alike. Every request counts.
 */
export async function limitResetRequests(event: H3Event, email: string) {
  if (!(await reserveAttempt(useDatabase(), clientAddress(event), `reset:${email}`, signInLimits()))) {
    fail(429, 'Too many requests from here. Wait 15 minutes and try again.')
  }
}

/**
 * The routes that take a link's token (opening or accepting an invitation,
 * resetting with a password) are limited like sign-in: each failure counts
 * against the client address's allowance (the same 30 in 15 minutes that failed
 * sign-ins and reset requests use), before any password is hashed. A request
 * that succeeds is not counted.
 */
export async function withTokenAttemptLimit<T>(event: H3Event, kind: 'invitation' | 'password-reset', work: () => Promise<T>): Promise<T> {
  const db = useDatabase()
  const ip = clientAddress(event)
  const limits = signInLimits()
  // Keyed by the address: a link failure has no account to count against.
  const attempt = await reserveAttempt(db, ip, `${kind}:${ip}`, { ...limits, maxPerAccount: limits.maxPerAddress })
  if (!attempt) fail(429, 'Too many tries from here. Wait 15 minutes and try again.')
  const result = await work()
  await releaseAttempt(db, attempt)
  return result
}
