import { afterAll, describe, expect, it } from 'vitest'
import { api, newWorkshop, uniqueEmail } from '../support/http'
import { templateId } from '../support/records'
import { testSql, waitForMailTo } from '../support/mail'

// Class guarded: "Creating a lot, set, account or membership that already exists answers 409 with
// a plain sentence even when two requests race (the unique violation is caught, not only checked
// first), and never does the thing twice."

afterAll(async () => {
  await testSql().end()
})

const tally = (statuses: number[]) => statuses.reduce<Record<number, number>>((t, s) => ({ ...t, [s]: (t[s] ?? 0) + 1 }), {})
const parallel = <T>(n: number, make: (i: number) => Promise<T>) => Promise.all(Array.from({ length: n }, (_, i) => make(i)))

describe('accounts: racing creations answer 409 once the first one wins', () => {
  it('eight lots with one code at once: one 201, seven 409, one row', async () => {
    const owner = await newWorkshop()
    const code = `RACE-${Date.now()}`
    const replies = await parallel(8, () => api('/api/lots', { method: 'POST', token: owner.token, body: { code, material: 'rosewood' } }))
    expect(tally(replies.map(r => r.status))).toEqual({ 201: 1, 409: 7 })
    expect(replies.find(r => r.status === 409)!.body.message).toBe(`A lot with code ${code} already exists.`)
    const [{ n }] = await testSql()`select count(*)::int as n from lots where workshop_id = ${owner.workshopId} and code = ${code}`
    expect(n).toBe(1)
  })

  it('six sets with one serial number at once: one 201, five 409, one set and only its pieces', async () => {
    const owner = await newWorkshop()
    const serial = `RACE-${Date.now()}`
    const body = {
      name: 'Race marimba', model: 'RM-1', serial, buyer: { name: 'A Buyer', organisation: '', email: 'buyer@example.test' },
      referenceHz: 440, fromNote: 'C4', toNote: 'E4', chromatic: true, templateId: await templateId(owner.token, 'Marimba bar, double (1 : 4)'),
    }
    const replies = await parallel(6, () => api('/api/sets', { method: 'POST', token: owner.token, body }))
    expect(tally(replies.map(r => r.status))).toEqual({ 201: 1, 409: 5 })
    expect(replies.find(r => r.status === 409)!.body.message).toBe(`A set with serial number ${serial} already exists.`)
    const [{ sets, pieces }] = await testSql()`select (select count(*)::int from sets where workshop_id = ${owner.workshopId} and serial = ${serial}) as sets,
      (select count(*)::int from pieces p join sets s on s.id = p.set_id where s.workshop_id = ${owner.workshopId} and s.serial = ${serial}) as pieces`
    expect(sets).toBe(1)
    expect(pieces).toBe(5) // C4, C#4, D4, D#4, E4: chromatic // common practice
  })

  it('six sign-ups with one e-mail at once: one account, one workshop, 409 for the rest', async () => {
    const email = uniqueEmail('race')
    const workshopName = `Race workshop ${Date.now()}`
    const replies = await parallel(6, () => api('/api/auth/signup', { method: 'POST', body: { name: 'Racer', email, password: 'racing-password-1', workshopName } }))
    expect(tally(replies.map(r => r.status))).toEqual({ 200: 1, 409: 5 })
    expect(replies.find(r => r.status === 409)!.body.message).toMatch(/cannot be used to sign up/)
    const [{ users, workshops }] = await testSql()`select (select count(*)::int from users where lower(email) = ${email}) as users,
      (select count(*)::int from workshops where name = ${workshopName}) as workshops`
    expect(users).toBe(1)
    expect(workshops).toBe(1)
  })

  it('six adds of one new address at once: one account, one membership, 409 for the rest', async () => {
    const owner = await newWorkshop()
    const email = uniqueEmail('race-member')
    const replies = await parallel(6, () => api('/api/team', { method: 'POST', token: owner.token, body: { name: 'Racer', email, role: 'office', temporaryPassword: 'temporary-pass-123' } }))
    expect(tally(replies.map(r => r.status))).toEqual({ 201: 1, 409: 5 })
    expect(replies.find(r => r.status === 409)!.body.message).toBe('That person is already a member of this workshop.')
    const [{ users, members }] = await testSql()`select (select count(*)::int from users where lower(email) = ${email}) as users,
      (select count(*)::int from memberships m join users u on u.id = m.user_id where lower(u.email) = ${email}) as members`
    expect(users).toBe(1)
    expect(members).toBe(1)
  })

  it('one invitation accepted six times at once: one membership, one account', async () => {
    const owner = await newWorkshop()
    const email = uniqueEmail('race-join')
    await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { email, role: 'benchmaker' } })
    const token = /\/join\?token=([\w-]+)/.exec((await waitForMailTo(email)).text)![1]!
    const replies = await parallel(6, () => api('/api/invitations/accept', { method: 'POST', body: { token, name: 'Joiner', password: 'joining-password-1' } }))
    expect(tally(replies.map(r => r.status))).toEqual({ 200: 1, 404: 5 })
    const [{ members }] = await testSql()`select count(*)::int as members from memberships m join users u on u.id = m.user_id where lower(u.email) = ${email}`
    expect(members).toBe(1)
  })

  it('two owners adding one existing account at once leave one live invitation and no membership', async () => {
    const owner = await newWorkshop()
    const person = await newWorkshop()
    const replies = await parallel(5, () => api('/api/team', { method: 'POST', token: owner.token, body: { name: 'P', email: person.email, role: 'office', temporaryPassword: 'temporary-pass-123' } }))
    expect(tally(replies.map(r => r.status))).toEqual({ 201: 5 })
    const [{ live, members }] = await testSql()`select
      (select count(*)::int from invitations where workshop_id = ${owner.workshopId} and used_at is null and revoked_at is null) as live,
      (select count(*)::int from memberships where workshop_id = ${owner.workshopId} and user_id = ${person.userId}) as members`
    expect(live).toBe(1)
    expect(members).toBe(0)
  })
})
