import { randomBytes } from 'node:crypto'
import { afterAll, describe, expect, it } from 'vitest'
import { api, newWorkshop, uniqueEmail } from '../support/http'
import { testSql, waitForMailTo } from '../support/mail'

// Classes guarded: "Sign-in and reset limits hold under parallel requests (count and decide in one
// statement or under a lock)", "Limits keyed by client address name the trusted proxy setting they
// rely on (NUXT_TRUSTED_PROXIES)", and "Accepting an invitation or resetting with a password is
// rate-limited like sign-in". The test server trusts 127.0.0.1 as a proxy (scripts/test.sh), so each
// test speaks for an address of its own with X-Forwarded-For.

const PER_ACCOUNT = 8 // server/utils/rate-limit.ts DEFAULT_SIGN_IN_LIMITS.maxPerAccount
const PER_ADDRESS = Number(process.env.NUXT_SIGN_IN_MAX_PER_ADDRESS ?? 30)
/** An address of its own for each test. source: RFC 3849 (2001:db8::/32 is for documentation) */
const address = () => `2001:db8::${randomBytes(2).toString('hex')}:${randomBytes(2).toString('hex')}`
const from = (ip: string) => ({ 'x-forwarded-for': ip })
const madeUpToken = () => randomBytes(32).toString('base64url')
const tally = (statuses: number[]) => statuses.reduce<Record<number, number>>((t, s) => ({ ...t, [s]: (t[s] ?? 0) + 1 }), {})

afterAll(async () => {
  await testSql().end()
})

describe('accounts: limits hold under parallel requests', () => {
  it('ten simultaneous wrong passwords for one e-mail get 8 × 401 and 429 for the rest', async () => {
    const owner = await newWorkshop()
    const ip = address()
    const replies = await Promise.all(Array.from({ length: 10 }, () =>
      api('/api/auth/login', { method: 'POST', headers: from(ip), body: { email: owner.email, password: 'wrong-password-guess' } })))
    expect(tally(replies.map(r => r.status))).toEqual({ 401: PER_ACCOUNT, 429: 10 - PER_ACCOUNT })
    expect(replies.find(r => r.status === 429)!.body.message).toMatch(/Too many sign-in attempts/)
    const [{ n }] = await testSql()`select count(*)::int as n from login_attempts where email = ${owner.email}`
    expect(n).toBe(PER_ACCOUNT)
    // The account stays locked for the window, even for the right password, from anywhere.
    expect((await api('/api/auth/login', { method: 'POST', headers: from(address()), body: { email: owner.email, password: owner.password } })).status).toBe(429)
  })

  it('ten simultaneous reset requests for one e-mail get 8 answers, 429 for the rest, and at most 3 links', async () => {
    const owner = await newWorkshop()
    const ip = address()
    const replies = await Promise.all(Array.from({ length: 10 }, () =>
      api('/api/auth/forgot-password', { method: 'POST', headers: from(ip), body: { email: owner.email } })))
    expect(tally(replies.map(r => r.status))).toEqual({ 200: PER_ACCOUNT, 429: 10 - PER_ACCOUNT })
    const [{ n }] = await testSql()`select count(*)::int as n from password_resets where user_id = ${owner.userId}`
    expect(n).toBe(3) // RESETS_PER_HOUR in server/utils/password-resets.ts
  })
})

describe('accounts: per-address limits and NUXT_TRUSTED_PROXIES', () => {
  it('counts the client address named by the trusted proxy, never one the client wrote itself', async () => {
    const blocked = address()
    // The address has used its whole allowance (written directly: PER_ADDRESS is large in tests).
    await testSql()`insert into login_attempts (ip, email) select ${blocked}, 'filler-' || g from generate_series(1, ${PER_ADDRESS}) g`
    const tryFrom = (forwardedFor: string) => api('/api/auth/login', { method: 'POST', headers: { 'x-forwarded-for': forwardedFor }, body: { email: uniqueEmail(), password: 'wrong-password-guess' } })
    expect((await tryFrom(blocked)).status).toBe(429)
    expect((await tryFrom(address())).status).toBe(401)
    // A client that prepends another address is still itself (the proxy appends the real one on the right).
    expect((await tryFrom(`${address()}, ${blocked}`)).status).toBe(429)
    // And a client cannot borrow the blocked address's identity to hurt it, nor hide behind it.
    expect((await tryFrom(`${blocked}, ${address()}`)).status).toBe(401)
  })
})

describe('accounts: links are rate-limited like sign-in', () => {
  /** An address with only `left` failures of its allowance left (written directly: PER_ADDRESS is large in tests). */
  async function addressWith(left: number) {
    const ip = address()
    await testSql()`insert into login_attempts (ip, email) select ${ip}, 'filler-' || g from generate_series(1, ${PER_ADDRESS - left}) g`
    return ip
  }

  it('opening or accepting invitations with made-up links: the address\'s allowance, then 429 even for a good link', async () => {
    const ip = await addressWith(8)
    const replies = await Promise.all(Array.from({ length: 10 }, (_, i) => i % 2
      ? api('/api/invitations/accept', { method: 'POST', headers: from(ip), body: { token: madeUpToken(), name: 'Guess', password: 'guessing-password-1' } })
      : api('/api/invitations/lookup', { method: 'POST', headers: from(ip), body: { token: madeUpToken() } })))
    expect(tally(replies.map(r => r.status))).toEqual({ 404: 8, 429: 2 })

    const owner = await newWorkshop()
    const email = uniqueEmail('limited')
    await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { email, role: 'office' } })
    const token = /\/join\?token=([\w-]+)/.exec((await waitForMailTo(email)).text)![1]!
    const body = { token, name: 'Real Invitee', password: 'real-invitee-password' }
    expect((await api('/api/invitations/accept', { method: 'POST', headers: from(ip), body })).status).toBe(429)
    // From another address the same link works, and a success is not counted against that address.
    const fresh = await addressWith(1)
    expect((await api('/api/invitations/accept', { method: 'POST', headers: from(fresh), body })).status).toBe(200)
    expect((await api('/api/invitations/lookup', { method: 'POST', headers: from(fresh), body: { token: madeUpToken() } })).status).toBe(404)
  })

  it('resetting with made-up links: the address\'s allowance, then 429', async () => {
    const ip = await addressWith(8)
    const replies = await Promise.all(Array.from({ length: 10 }, () =>
      api('/api/auth/reset-password', { method: 'POST', headers: from(ip), body: { token: madeUpToken(), password: 'guessing-password-1' } })))
    expect(tally(replies.map(r => r.status))).toEqual({ 400: 8, 429: 2 })
    expect(replies.find(r => r.status === 429)!.body.message).toMatch(/Wait 15 minutes/)
  })
})
