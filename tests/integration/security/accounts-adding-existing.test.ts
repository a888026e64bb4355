import { afterAll, describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop, uniqueEmail } from '../support/http'
import { testSql, waitForMailTo } from '../support/mail'

// Class guarded: "Adding a person who already has an account never links it silently;
// the adder never learns the person's name or whether the address has an account."

const joinToken = (text: string) => /\/join\?token=([\w-]+)/.exec(text)?.[1]

afterAll(async () => {
  await testSql().end()
})

describe('accounts: adding an address that already has an account', () => {
  it('answers exactly like a new address, shows nothing of the account and links nothing', async () => {
    const adder = await newWorkshop('Fernbrook Bars')
    // Someone with an account in a workshop of their own: the adder does not know them.
    const stranger = await newWorkshop('Quietwater Bells')
    const body = (email: string) => ({ name: 'Typed By Adder', email, role: 'supervisor', temporaryPassword: 'temporary-pass-123' })
    const existing = await api('/api/team', { method: 'POST', token: adder.token, body: body(stranger.email) })
    const fresh = await api('/api/team', { method: 'POST', token: adder.token, body: body(uniqueEmail('fresh')) })

    expect(existing.status).toBe(fresh.status)
    expect(Object.keys(existing.body).sort()).toEqual(Object.keys(fresh.body).sort())
    expect(existing.body.message).toBe(fresh.body.message)
    expect(existing.body.name).toBe('Typed By Adder')
    // Neither the account's own name nor its id comes back.
    expect(JSON.stringify(existing.body)).not.toContain('Test Owner')
    expect(JSON.stringify(existing.body)).not.toContain(stranger.userId)

    // Not linked: the adder's team does not hold the stranger, the stranger's session does not list the workshop.
    const team = await api('/api/team', { token: adder.token })
    expect(team.body.map((m: { email: string }) => m.email)).not.toContain(stranger.email)
    const before = await api('/api/auth/session', { token: stranger.token })
    expect(before.body.workshops.map((w: { id: string }) => w.id)).not.toContain(adder.workshopId)
    const [{ n }] = await testSql()`select count(*)::int as n from memberships where workshop_id = ${adder.workshopId} and user_id = ${stranger.userId}`
    expect(n).toBe(0)
    // The stranger's password was not touched by the adder's temporary one.
    expect((await api('/api/auth/login', { method: 'POST', body: { email: stranger.email, password: 'temporary-pass-123' } })).status).toBe(401)
  })

  it('sends an invitation that joins only when the account accepts it signed in as itself', async () => {
    const adder = await newWorkshop('Fernbrook Bars')
    const person = await newWorkshop('Own Workshop')
    const someoneElse = await memberWithRole(adder.token, 'office')
    await api('/api/team', { method: 'POST', token: adder.token, body: { name: 'P', email: person.email, role: 'benchmaker', temporaryPassword: 'temporary-pass-123' } })
    const message = await waitForMailTo(person.email)
    expect(message.text).toMatch(/already have a Tonewright account/)
    const token = joinToken(message.text)!
    expect((await api('/api/invitations/lookup', { method: 'POST', body: { token } })).body.hasAccount).toBe(true)

    const anonymous = await api('/api/invitations/accept', { method: 'POST', body: { token, name: 'X', password: 'guessed-password-1' } })
    expect(anonymous.status).toBe(401)
    const wrongAccount = await api('/api/invitations/accept', { method: 'POST', token: someoneElse.token, body: { token } })
    expect(wrongAccount.status).toBe(403)
    expect(wrongAccount.body.message).toMatch(/another e-mail address/)
    const [{ n: stillNone }] = await testSql()`select count(*)::int as n from memberships where workshop_id = ${adder.workshopId} and user_id = ${person.userId}`
    expect(stillNone).toBe(0)

    const accepted = await api('/api/invitations/accept', { method: 'POST', token: person.token, body: { token } })
    expect(accepted.status).toBe(200)
    const session = await api('/api/auth/session', { token: person.token })
    expect(session.body.workshops).toContainEqual(expect.objectContaining({ id: adder.workshopId, role: 'benchmaker' }))
    // Still the person's own workshop too, and their own password.
    expect(session.body.workshops).toContainEqual(expect.objectContaining({ id: person.workshopId, role: 'owner' }))
    expect((await api('/api/auth/login', { method: 'POST', body: { email: person.email, password: person.password } })).status).toBe(200)
  })

  it('answers 409 for an address that is already a member, and 403 to a role that may not add', async () => {
    const owner = await newWorkshop()
    const office = await memberWithRole(owner.token, 'office')
    const again = await api('/api/team', { method: 'POST', token: owner.token, body: { name: 'Again', email: office.email, role: 'office', temporaryPassword: 'temporary-pass-123' } })
    expect(again.status).toBe(409)
    expect(again.body.message).toBe('That person is already a member of this workshop.')
    const byOffice = await api('/api/team', { method: 'POST', token: office.token, body: { name: 'N', email: owner.email, role: 'owner', temporaryPassword: 'temporary-pass-123' } })
    expect(byOffice.status).toBe(403)
  })
})
