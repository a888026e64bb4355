import { afterAll, describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop, uniqueEmail } from '../support/http'
import { testSql, waitForMailTo } from '../support/mail'

// Class guarded: "An invitation dies when its inviter loses the right to invite (removed or
// demoted), can be revoked from the Team screen, and carries the role the inviter was allowed
// to give at the time of acceptance."

const joinToken = (text: string) => /\/join\?token=([\w-]+)/.exec(text)![1]!

afterAll(async () => {
  await testSql().end()
})

/** A workshop with a second owner who sends an invitation to a new address. */
async function invitationFromSecondOwner(role = 'supervisor') {
  const owner = await newWorkshop('Larchgate Vibes')
  const inviter = await memberWithRole(owner.token, 'owner')
  const email = uniqueEmail('invitee')
  const sent = await api('/api/team/invitations', { method: 'POST', token: inviter.token, body: { email, role } })
  expect(sent.status).toBe(201)
  const token = joinToken((await waitForMailTo(email)).text)
  expect((await api('/api/invitations/lookup', { method: 'POST', body: { token } })).status).toBe(200)
  return { owner, inviter, email, token, invitationId: sent.body.id as string }
}

const accept = (token: string) => api('/api/invitations/accept', { method: 'POST', body: { token, name: 'Invitee', password: 'invitee-password-1' } })

async function revocationAudit(invitationId: string) {
  return testSql()`select action, reason from audit_events where subject_id = ${invitationId} and action = 'invitation.revoke'`
}

describe('accounts: invitations follow the inviter\'s right to invite', () => {
  it('dies when the inviter is demoted', async () => {
    const { owner, inviter, token, invitationId, email } = await invitationFromSecondOwner()
    expect((await api(`/api/team/${inviter.userId}`, { method: 'PATCH', token: owner.token, body: { role: 'office' } })).status).toBe(200)
    expect((await api('/api/invitations/lookup', { method: 'POST', body: { token } })).status).toBe(404)
    const refused = await accept(token)
    expect(refused.status).toBe(404)
    expect(refused.body.message).toMatch(/revoked/)
    expect(await revocationAudit(invitationId)).toEqual([expect.objectContaining({ reason: 'The inviter may no longer give this role.' })])
    const [{ n }] = await testSql()`select count(*)::int as n from users where lower(email) = ${email}`
    expect(n).toBe(0)
  })

  it('dies when the inviter is removed', async () => {
    const { owner, inviter, token, invitationId } = await invitationFromSecondOwner('benchmaker')
    expect((await api(`/api/team/${inviter.userId}`, { method: 'DELETE', token: owner.token })).status).toBe(200)
    expect((await accept(token)).status).toBe(404)
    expect(await revocationAudit(invitationId)).toEqual([expect.objectContaining({ reason: 'The inviter left the workshop.' })])
  })

  it('is checked again at acceptance: the role is what the inviter may give now, not when it was sent', async () => {
    const { inviter, owner, token } = await invitationFromSecondOwner()
    // A change of role that bypassed the Team routes (no eager revocation): the acceptance itself must refuse.
    await testSql()`update memberships set role = 'benchmaker' where workshop_id = ${owner.workshopId} and user_id = ${inviter.userId}`
    expect((await accept(token)).status).toBe(404)
    await testSql()`update memberships set role = 'owner' where workshop_id = ${owner.workshopId} and user_id = ${inviter.userId}`
    const accepted = await accept(token)
    expect(accepted.status).toBe(200)
    expect(accepted.body.role).toBe('supervisor')
  })

  it('keeps working while the inviter keeps the right (a control for the tests above)', async () => {
    const { owner, token } = await invitationFromSecondOwner('office')
    await memberWithRole(owner.token, 'benchmaker')
    expect((await accept(token)).status).toBe(200)
  })
})

describe('accounts: revoking an invitation from the Team screen', () => {
  it('lists pending invitations to the owner, revokes one (audited), and the link stops working', async () => {
    const owner = await newWorkshop()
    const email = uniqueEmail('pending')
    const sent = await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { name: 'Pending Person', email, role: 'office' } })
    const token = joinToken((await waitForMailTo(email)).text)
    const listed = await api('/api/team/invitations', { token: owner.token })
    expect(listed.status).toBe(200)
    expect(listed.body).toEqual([expect.objectContaining({ id: sent.body.id, email, role: 'office', name: 'Pending Person', invitedBy: 'Test Owner' })])
    expect(JSON.stringify(listed.body)).not.toMatch(/token/i)

    const revoked = await api(`/api/team/invitations/${sent.body.id}/revoke`, { method: 'POST', token: owner.token })
    expect(revoked.status).toBe(200)
    expect((await api('/api/team/invitations', { token: owner.token })).body).toEqual([])
    expect((await api('/api/invitations/lookup', { method: 'POST', body: { token } })).status).toBe(404)
    expect((await accept(token)).status).toBe(404)
    expect(await revocationAudit(sent.body.id)).toHaveLength(1)
    const twice = await api(`/api/team/invitations/${sent.body.id}/revoke`, { method: 'POST', token: owner.token })
    expect(twice.status).toBe(409)
    expect(twice.body.message).toBe('That invitation was already revoked.')
  })

  it('answers 404 to another workshop, 403 to a role without the right, 400 to a malformed id', async () => {
    const owner = await newWorkshop()
    const other = await newWorkshop()
    const office = await memberWithRole(owner.token, 'office')
    const email = uniqueEmail('kept')
    const sent = await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { email, role: 'benchmaker' } })
    expect((await api(`/api/team/invitations/${sent.body.id}/revoke`, { method: 'POST', token: other.token })).status).toBe(404)
    expect((await api('/api/team/invitations', { token: other.token })).body).toEqual([])
    expect((await api(`/api/team/invitations/${sent.body.id}/revoke`, { method: 'POST', token: office.token })).status).toBe(403)
    expect((await api('/api/team/invitations', { token: office.token })).status).toBe(403)
    expect((await api('/api/team/invitations/not-a-uuid/revoke', { method: 'POST', token: owner.token })).status).toBe(400)
    // Nothing of that was saved: the invitation still works.
    const token = joinToken((await waitForMailTo(email)).text)
    expect((await accept(token)).status).toBe(200)
  })

  it('a new invitation to the same address replaces the older one', async () => {
    const owner = await newWorkshop()
    const email = uniqueEmail('twice')
    await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { email, role: 'office' } })
    const first = joinToken((await waitForMailTo(email)).text)
    await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { email, role: 'benchmaker' } })
    expect((await api('/api/team/invitations', { token: owner.token })).body).toHaveLength(1)
    expect((await accept(first)).status).toBe(404)
  })
})
