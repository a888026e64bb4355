import { describe, expect, it } from 'vitest'
import { api, memberOnTemporaryPassword, memberWithRole, newWorkshop, uniqueEmail } from '../../../support/http'

describe('team', () => {
  it('lists the members of the current workshop', async () => {
    const owner = await newWorkshop()
    await memberWithRole(owner.token, 'benchmaker')
    const reply = await api('/api/team', { token: owner.token })
    expect(reply.status).toBe(200)
    expect(reply.body.map((m: { role: string }) => m.role).sort()).toEqual(['benchmaker', 'owner'])
    expect(reply.body[0]).not.toHaveProperty('passwordHash')
  })

  it('gives a benchmaker 403 on an owner-only route and saves nothing', async () => {
    const owner = await newWorkshop()
    const bench = await memberWithRole(owner.token, 'benchmaker')
    const reply = await api('/api/team', { method: 'POST', token: bench.token, body: { name: 'Y', email: uniqueEmail(), role: 'owner', temporaryPassword: 'temporary-pass-123' } })
    expect(reply.status).toBe(403)
    const team = await api('/api/team', { token: owner.token })
    expect(team.body).toHaveLength(2)
  })

  it('answers 404 when a member of workshop A asks for workshop B\'s member list', async () => {
    const a = await newWorkshop('Workshop A')
    const b = await newWorkshop('Workshop B')
    const reply = await api('/api/team', { token: a.token, headers: { 'x-workshop-id': b.workshopId } })
    expect(reply.status).toBe(404)
    expect(JSON.stringify(reply.body)).not.toContain(b.email)
  })

  it('changes a role, and refuses to demote or remove the last owner', async () => {
    const owner = await newWorkshop()
    const sup = await memberWithRole(owner.token, 'supervisor')
    const changed = await api(`/api/team/${sup.userId}`, { method: 'PATCH', token: owner.token, body: { role: 'office' } })
    expect(changed.status).toBe(200)
    expect(changed.body.role).toBe('office')
    const demote = await api(`/api/team/${owner.userId}`, { method: 'PATCH', token: owner.token, body: { role: 'benchmaker' } })
    expect(demote.status).toBe(409)
    const remove = await api(`/api/team/${owner.userId}`, { method: 'DELETE', token: owner.token })
    expect(remove.status).toBe(409)
    const team = await api('/api/team', { token: owner.token })
    expect(team.body.find((m: { userId: string }) => m.userId === owner.userId).role).toBe('owner')
  })

  it('removes a member, whose token then no longer opens the workshop', async () => {
    const owner = await newWorkshop()
    const office = await memberWithRole(owner.token, 'office')
    expect((await api('/api/team', { token: office.token })).status).toBe(200)
    const removed = await api(`/api/team/${office.userId}`, { method: 'DELETE', token: owner.token })
    expect(removed.status).toBe(200)
    expect((await api('/api/team', { token: office.token })).status).toBe(404)
  })

  it('refuses an unknown role with a plain 400', async () => {
    const owner = await newWorkshop()
    const reply = await api('/api/team', { method: 'POST', token: owner.token, body: { name: 'Z', email: uniqueEmail(), role: 'admin', temporaryPassword: 'temporary-pass-123' } })
    expect(reply.status).toBe(400)
    expect(reply.body.message).toMatch(/role/i)
  })

  it('answers 400 for a malformed member id, 404 for another workshop\'s member', async () => {
    const a = await newWorkshop()
    const b = await newWorkshop()
    expect((await api('/api/team/not-a-uuid', { method: 'PATCH', token: a.token, body: { role: 'office' } })).status).toBe(400)
    expect((await api(`/api/team/${b.userId}`, { method: 'DELETE', token: a.token })).status).toBe(404)
  })
})

describe('temporary passwords', () => {
  it('flags a member added with a temporary password until they choose their own', async () => {
    const owner = await newWorkshop()
    const bench = await memberOnTemporaryPassword(owner.token, 'benchmaker')
    expect((await api('/api/auth/session', { token: bench.token })).body.mustChangePassword).toBe(true)
    const wrong = await api('/api/auth/password', { method: 'POST', token: bench.token, body: { currentPassword: 'not-it-at-all', newPassword: 'my-own-password-1' } })
    expect(wrong.status).toBe(400)
    const ok = await api('/api/auth/password', { method: 'POST', token: bench.token, body: { currentPassword: 'temporary-pass-123', newPassword: 'my-own-password-1' } })
    expect(ok.status).toBe(200)
    expect((await api('/api/auth/session', { token: bench.token })).body.mustChangePassword).toBe(false)
    const signIn = await api('/api/auth/login', { method: 'POST', body: { email: bench.email, password: 'my-own-password-1' } })
    expect(signIn.status).toBe(200)
  })
})
