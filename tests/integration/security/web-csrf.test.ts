import { describe, expect, it } from 'vitest'
import { api, BASE_URL, memberWithRole, newWorkshop } from '../support/http'

// Class guarded here: state-changing requests authenticated by the sign-in cookie
// are refused unless our own pages sent them; JSON routes take only JSON.

/** A request as a browser sends it: the session in the cookie, no Authorization header. */
async function withCookie(path: string, token: string, init: { method?: string, headers?: Record<string, string>, body?: string } = {}) {
  const response = await fetch(`${BASE_URL}${path}`, {
    method: init.method ?? 'POST',
    headers: { 'cookie': `auth.token=${encodeURIComponent(`Bearer ${token}`)}`, 'content-type': 'application/json', ...init.headers },
    body: init.body,
  })
  const text = await response.text()
  let body: { message?: string } | string = text
  try {
    body = JSON.parse(text)
  }
  catch { /* keep the text */ }
  return { status: response.status, body }
}

const lot = (code: string) => JSON.stringify({ code, material: 'Honduras rosewood billets' })
const lotCodes = async (token: string) => ((await api('/api/lots', { token })).body as { code: string }[]).map(l => l.code)

describe('cross-site requests with the sign-in cookie are refused', () => {
  it('refuses a cookie-authenticated POST from another origin (403, a sentence) and saves nothing', async () => {
    const owner = await newWorkshop('CSRF target')
    const reply = await withCookie('/api/lots', owner.token, { headers: { origin: 'https://attacker.example' }, body: lot('EVIL-1') })
    expect(reply.status).toBe(403)
    expect((reply.body as { message: string }).message).toMatch(/another site/)
    expect(await lotCodes(owner.token)).not.toContain('EVIL-1')
  })

  it('refuses the cookie without Origin unless Sec-Fetch-Site says same-origin', async () => {
    const owner = await newWorkshop('CSRF fetch metadata')
    expect((await withCookie('/api/lots', owner.token, { body: lot('NONE-1') })).status).toBe(403)
    expect((await withCookie('/api/lots', owner.token, { headers: { 'sec-fetch-site': 'cross-site' }, body: lot('XS-1') })).status).toBe(403)
    expect((await withCookie('/api/lots', owner.token, { headers: { 'sec-fetch-site': 'same-site' }, body: lot('SS-1') })).status).toBe(403)
    expect((await withCookie('/api/lots', owner.token, { headers: { origin: 'null' }, body: lot('NULL-1') })).status).toBe(403)
    expect((await withCookie('/api/lots', owner.token, { headers: { 'sec-fetch-site': 'same-origin' }, body: lot('SO-1') })).status).toBe(201)
    expect(await lotCodes(owner.token)).toEqual(['SO-1'])
  })

  it('accepts the cookie from our own origin', async () => {
    const owner = await newWorkshop('CSRF own origin')
    expect((await withCookie('/api/lots', owner.token, { headers: { origin: BASE_URL }, body: lot('OWN-1') })).status).toBe(201)
  })

  it('guards every state-changing method: removing a member, changing a role and signing out', async () => {
    const owner = await newWorkshop('CSRF methods')
    const office = await memberWithRole(owner.token, 'office')
    const evil = { origin: 'https://attacker.example' }
    expect((await withCookie(`/api/team/${office.userId}`, owner.token, { method: 'DELETE', headers: evil })).status).toBe(403)
    expect((await withCookie(`/api/team/${office.userId}`, owner.token, { method: 'PATCH', headers: evil, body: JSON.stringify({ role: 'owner' }) })).status).toBe(403)
    expect((await withCookie('/api/auth/logout', owner.token, { headers: evil })).status).toBe(403)
    const team = (await api('/api/team', { token: owner.token })).body as { members: { userId: string, role: string }[] } | { userId: string, role: string }[]
    const members = Array.isArray(team) ? team : team.members
    expect(members.find(m => m.userId === office.userId)?.role).toBe('office')
    expect((await api('/api/auth/session', { token: owner.token })).status).toBe(200)
  })

  it('reads with the cookie still work from anywhere (CORS keeps the answer from other sites)', async () => {
    const owner = await newWorkshop('CSRF reads')
    expect((await withCookie('/api/lots', owner.token, { method: 'GET', headers: { origin: 'https://attacker.example' } })).status).toBe(200)
  })

  it('leaves bearer-token clients alone, whatever Origin they send', async () => {
    const owner = await newWorkshop('CSRF bearer')
    const reply = await api('/api/lots', { method: 'POST', token: owner.token, body: { code: 'BEARER-1', material: 'Aluminium bar stock' }, headers: { origin: 'https://tool.example' } })
    expect(reply.status).toBe(201)
  })

  it('refuses a sign-in posted from another site\'s form', async () => {
    const owner = await newWorkshop('CSRF sign-in')
    const reply = await fetch(`${BASE_URL}/api/auth/login`, {
      method: 'POST',
      headers: { 'origin': 'https://attacker.example', 'content-type': 'application/json' },
      body: JSON.stringify({ email: owner.email, password: owner.password }),
    })
    expect(reply.status).toBe(403)
  })

  it('refuses a cross-site request with a damaged or huge cookie as cross-site (403), never 500', async () => {
    for (const cookie of ['auth.token=%E0%A4%A', `auth.token=Bearer%20${'x'.repeat(5000)}`, 'auth.token="unterminated']) {
      const reply = await fetch(`${BASE_URL}/api/lots`, { method: 'POST', headers: { cookie, 'origin': 'https://attacker.example', 'content-type': 'application/json' }, body: lot('BAD-1') })
      expect(reply.status).toBe(403)
    }
  })
})

describe('JSON routes take only JSON; uploads only multipart', () => {
  it('refuses form-encoded, text and untyped bodies on JSON routes with 415 and a sentence', async () => {
    const owner = await newWorkshop('Content types')
    for (const type of ['application/x-www-form-urlencoded', 'text/plain', 'multipart/form-data; boundary=x', 'application/xml']) {
      const sent = await fetch(`${BASE_URL}/api/lots`, { method: 'POST', headers: { 'authorization': `Bearer ${owner.token}`, 'content-type': type }, body: 'code=FORM-1&material=Maple' })
      expect(sent.status, type).toBe(415)
      expect(((await sent.json()) as { message: string }).message).toMatch(/JSON/)
    }
    const untyped = await fetch(`${BASE_URL}/api/lots`, { method: 'POST', headers: { authorization: `Bearer ${owner.token}` }, body: new Uint8Array(Buffer.from('{"code":"RAW-1","material":"Maple"}')) })
    expect(untyped.status).toBe(415)
    expect(await lotCodes(owner.token)).toEqual([])
  })

  it('refuses a form-encoded sign-in (what a cross-site HTML form would send)', async () => {
    const reply = await fetch(`${BASE_URL}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: 'email=a%40example.test&password=whatever-long' })
    expect(reply.status).toBe(415)
  })

  it('accepts JSON with a charset parameter', async () => {
    const owner = await newWorkshop('JSON charset')
    const reply = await fetch(`${BASE_URL}/api/lots`, { method: 'POST', headers: { 'authorization': `Bearer ${owner.token}`, 'content-type': 'application/json; charset=utf-8' }, body: lot('UTF-1') })
    expect(reply.status).toBe(201)
  })

  it('refuses JSON on an upload route with 415', async () => {
    const owner = await newWorkshop('Upload types')
    const reply = await api('/api/analyze', { method: 'POST', token: owner.token, body: { file: 'not a form' } })
    expect(reply.status).toBe(415)
    expect(reply.body.message).toMatch(/multipart/)
  })
})
