import { describe, expect, it } from 'vitest'
import { api, BASE_URL, newWorkshop } from '../support/http'

// Class guarded: "A malformed Authorization header or cookie (bad percent-encoding, wrong scheme,
// huge value) answers 401, never 500."

const SESSION_ENDED = /Sign in|session has ended/

describe('accounts: malformed credentials answer 401, never 500', () => {
  const cases: [string, Record<string, string>][] = [
    ['bad percent-encoding in the header', { authorization: 'Bearer %E0%A4%A' }],
    ['bad percent-encoding in the cookie', { cookie: 'auth.token=%E0%A4%A' }],
    ['bad percent-encoding after the scheme in the cookie', { cookie: 'auth.token=Bearer%20%E0%A4%A' }],
    ['another scheme', { authorization: 'Basic eHl6OnBhc3N3b3Jk' }],
    ['a scheme without a token', { authorization: 'Bearer' }],
    ['a token with characters no token has', { authorization: 'Bearer abc<def>ghi"jkl\'mno;pqr$stu' }],
    ['a long value (8 kB)', { authorization: `Bearer ${'a'.repeat(8 * 1024)}` }],
    ['a long cookie (8 kB)', { cookie: `auth.token=${'%41'.repeat(2700)}` }],
    ['a well-formed token that is not a session', { authorization: `Bearer ${'A'.repeat(43)}` }],
  ]
  for (const [what, headers] of cases) {
    it(`${what}: 401 with a plain sentence`, async () => {
      const reply = await api('/api/team', { headers })
      expect(reply.status).toBe(401)
      expect(reply.body.message).toMatch(SESSION_ENDED)
    })
  }

  it('a huge value (100 kB) is refused before any handler runs, with a 4xx', async () => {
    // Node refuses request headers beyond its limit (16 kB by default) with 431 before the app sees them.
    const reply = await fetch(`${BASE_URL}/api/team`, { headers: { authorization: `Bearer ${'a'.repeat(100 * 1024)}` } }).catch(() => null)
    if (reply) {
      expect(reply.status).toBeGreaterThanOrEqual(400)
      expect(reply.status).toBeLessThan(500)
    }
    // Whatever happened to that request, the server is still answering.
    expect((await api('/api/health')).status).toBe(200)
  })

  it('a malformed header does not fall back to a good cookie, nor break public routes and pages', async () => {
    const owner = await newWorkshop()
    const both = await api('/api/team', { headers: { authorization: 'Basic xyz', cookie: `auth.token=Bearer%20${owner.token}` } })
    expect(both.status).toBe(401)
    // The good token works through the cookie alone (a control for the case above).
    expect((await api('/api/team', { headers: { cookie: `auth.token=Bearer%20${owner.token}` } })).status).toBe(200)
    expect((await api('/api/auth/logout', { method: 'POST', headers: { authorization: 'Bearer %E0%A4%A' } })).status).toBe(200)
    const accept = await api('/api/invitations/accept', { method: 'POST', headers: { cookie: 'auth.token=%E0%A4%A', origin: new URL(BASE_URL).origin }, body: { token: 'A'.repeat(43), name: 'A', password: 'some-password-1' } })
    expect(accept.status).toBe(404)
    const page = await fetch(`${BASE_URL}/signin`, { headers: { cookie: 'auth.token=%E0%A4%A' } })
    expect(page.status).toBeLessThan(500)
  })
})
