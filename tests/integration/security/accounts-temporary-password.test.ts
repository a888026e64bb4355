import { randomUUID } from 'node:crypto'
import { afterAll, describe, expect, it } from 'vitest'
import { bodyPolicy } from '../../../server/utils/request-limits'
import { api, memberOnTemporaryPassword, memberWithRole, newWorkshop } from '../support/http'
import { allRoutes } from './routes'
import { testSql, waitForMailTo } from '../support/mail'

// Class guarded: "'Must change password' is enforced by the server for every API route except
// those needed to change it and sign out (403 with a plain sentence), not only by the browser."

afterAll(async () => {
  await testSql().end()
})

const SENTENCE = 'Choose your own password first: you signed in with a temporary one.'

/** Routes anyone may call without a session: the account's state does not matter to them. */
const PUBLIC = new Set([
  'POST /api/auth/login', 'POST /api/auth/signup', 'POST /api/auth/forgot-password', 'POST /api/auth/reset-password',
  'GET /api/health', 'GET /api/ready', 'GET /api/verify/:code', 'POST /api/invitations/lookup', 'POST /api/invitations/accept',
])
/** What a person on a temporary password still needs: read the session, change the password, sign out. */
const ALLOWED = new Set(['GET /api/auth/session', 'POST /api/auth/password', 'POST /api/auth/logout'])
/** Development-only routes that may not exist at all in the production build the tests run. */
const DEV_ONLY = /^GET \/api\/dev\//

function call(route: string, token: string) {
  const [method, path] = route.split(' ') as [string, string]
  const url = path.replace(/:file\b/, 'a.txt').replace(/:(\w+)/g, () => randomUUID())
  // Upload routes take multipart only (the request guard answers 415 to anything else first);
  // which routes those are is the guard's own list.
  const body = method === 'GET' ? undefined : bodyPolicy(method, url).kind === 'upload' ? new FormData() : {}
  return api(url, { method, token, body })
}

describe('accounts: a temporary password must be changed before anything else, on the server', () => {
  it('answers 403 with a plain sentence on every route but session, password change and sign-out', async () => {
    const owner = await newWorkshop()
    // An owner on a temporary password: the role would allow everything, the password state allows nothing.
    const member = await memberOnTemporaryPassword(owner.token, 'owner')
    const routes = allRoutes().filter(r => !PUBLIC.has(r) && !ALLOWED.has(r))
    expect(routes.length).toBeGreaterThan(30)
    const failures: string[] = []
    for (const route of routes) {
      const reply = await call(route, member.token)
      const ok = reply.status === 403 && reply.body?.message === SENTENCE
      if (!ok && !(DEV_ONLY.test(route) && reply.status === 404)) failures.push(`${route}: ${reply.status} ${JSON.stringify(reply.body).slice(0, 120)}`)
    }
    expect(failures).toEqual([])
  })

  it('still lets the person read the session, change the password and sign out; then everything opens', async () => {
    const owner = await newWorkshop()
    const member = await memberOnTemporaryPassword(owner.token, 'office')
    const session = await api('/api/auth/session', { token: member.token })
    expect(session.status).toBe(200)
    expect(session.body.mustChangePassword).toBe(true)
    expect((await api('/api/sets', { token: member.token })).status).toBe(403)
    const changed = await api('/api/auth/password', { method: 'POST', token: member.token, body: { currentPassword: member.temporaryPassword, newPassword: 'office-own-password-1' } })
    expect(changed.status).toBe(200)
    expect((await api('/api/sets', { token: member.token })).status).toBe(200)
    expect((await api('/api/auth/logout', { method: 'POST', token: member.token })).status).toBe(200)
  })

  it('does not touch an account with its own password (a control: the check can tell the two apart)', async () => {
    const owner = await newWorkshop()
    const member = await memberWithRole(owner.token, 'owner')
    for (const path of ['/api/team', '/api/sets', '/api/templates', '/api/team/invitations']) {
      expect((await api(path, { token: member.token })).status).toBe(200)
    }
  })

  it('refuses an invitation accepted by an account still on a temporary password', async () => {
    const owner = await newWorkshop()
    const other = await newWorkshop()
    const member = await memberOnTemporaryPassword(owner.token, 'office')
    await api('/api/team/invitations', { method: 'POST', token: other.token, body: { email: member.email, role: 'office' } })
    const token = /\/join\?token=([\w-]+)/.exec((await waitForMailTo(member.email)).text)![1]
    const reply = await api('/api/invitations/accept', { method: 'POST', token: member.token, body: { token } })
    expect(reply.status).toBe(403)
    expect(reply.body.message).toBe(SENTENCE)
    const [{ n }] = await testSql()`select count(*)::int as n from memberships where workshop_id = ${other.workshopId} and user_id = ${member.userId}`
    expect(n).toBe(0)
  })
})
