import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api, memberOnTemporaryPassword, memberWithRole, newWorkshop } from '../../../support/http'
import { createSet } from '../../../support/records'
import { testSql } from '../../../support/mail'

type Owner = Awaited<ReturnType<typeof newWorkshop>>
let owner: Owner
let office: Awaited<ReturnType<typeof memberWithRole>>
let bench: Awaited<ReturnType<typeof memberWithRole>>

const patch = (id: string, token: string, body: unknown) => api(`/api/sets/${id}`, { method: 'PATCH', token, body })
const editsOf = async (setId: string) =>
  testSql()`select details from audit_events where subject_id = ${setId} and action = 'set.edit' order by at` as Promise<{ details: { changes: { field: string, from: string | null, to: string | null }[] } }[]>

describe('PATCH /api/sets/{id}', () => {
  beforeAll(async () => {
    owner = await newWorkshop('Harrowgate Bar Works')
    office = await memberWithRole(owner.token, 'office')
    bench = await memberWithRole(owner.token, 'benchmaker')
  })
  afterAll(async () => {
    await testSql().end()
  })

  it('changes buyer, serial, model, due date and notes as office, and audits before and after', async () => {
    const set = await createSet(owner.token)
    const reply = await patch(set.id, office.token, {
      buyer: { name: 'Robin Ashdown', email: 'Robin@Example.test' }, serial: `${set.serial}-B`, model: 'TM-2', dueOn: '2027-01-15', notes: 'Ship with the soft mallets.',
    })
    expect(reply.status).toBe(200)
    const after = (await api(`/api/sets/${set.id}`, { token: office.token })).body
    expect(after).toMatchObject({ buyerName: 'Robin Ashdown', buyerEmail: 'robin@example.test', buyerOrganisation: 'A School', serial: `${set.serial}-B`, model: 'TM-2', dueOn: '2027-01-15', notes: 'Ship with the soft mallets.' })
    const [edit] = await editsOf(set.id)
    expect(edit!.details.changes).toEqual([
      { field: 'buyer', from: 'A Buyer', to: 'Robin Ashdown' },
      { field: 'buyer e-mail', from: 'buyer@example.test', to: 'robin@example.test' },
      { field: 'serial', from: set.serial, to: `${set.serial}-B` },
      { field: 'model', from: 'TM-1', to: 'TM-2' },
      { field: 'due date', from: null, to: '2027-01-15' },
      { field: 'notes', from: '', to: 'Ship with the soft mallets.' },
    ])
    // Clearing the due date is a change too; sending the same values again is none and is not audited.
    expect((await patch(set.id, owner.token, { dueOn: null })).status).toBe(200)
    expect((await patch(set.id, owner.token, { model: 'TM-2' })).status).toBe(200)
    expect((await editsOf(set.id)).map(e => e.details.changes.map(c => c.field))).toEqual([
      ['buyer', 'buyer e-mail', 'serial', 'model', 'due date', 'notes'], ['due date'],
    ])
  })

  it('refuses other roles (403), another workshop (404), and a serial another set has (409), changing nothing', async () => {
    const set = await createSet(owner.token)
    const other = await createSet(owner.token)
    expect((await patch(set.id, bench.token, { model: 'X' })).status).toBe(403)
    const supervisor = await memberWithRole(owner.token, 'supervisor')
    expect((await patch(set.id, supervisor.token, { model: 'X' })).status).toBe(403)
    const temporary = await memberOnTemporaryPassword(owner.token, 'office')
    expect((await patch(set.id, temporary.token, { model: 'X' })).status).toBe(403)
    const stranger = await newWorkshop('Elsewhere')
    const foreign = await patch(set.id, stranger.token, { model: 'X' })
    expect(foreign.status).toBe(404)
    expect(foreign.body.message).toBe('No such set in this workshop.')
    const clash = await patch(set.id, office.token, { serial: other.serial, model: 'Changed with the clash' })
    expect(clash.status).toBe(409)
    expect(clash.body.message).toContain(other.serial)
    const after = (await api(`/api/sets/${set.id}`, { token: owner.token })).body
    expect(after.model).toBe(set.model)
    expect(after.serial).toBe(set.serial)
    expect(await editsOf(set.id)).toHaveLength(0)
  })

  it('answers a malformed or empty request with 400 and a sentence', async () => {
    const set = await createSet(owner.token)
    const cases: [unknown, RegExp][] = [
      [{}, /at least one/],
      [{ buyer: {} }, /at least one/],
      [{ dueOn: '15/01/2027' }, /YYYY-MM-DD/],
      [{ buyer: { email: 'not-an-address' } }, /valid e-mail/],
      [{ serial: '' }, /serial/i],
      [{ serial: 'x'.repeat(61) }, /60 characters/],
      [{ notes: 'n'.repeat(2001) }, /2000 characters/],
      [{ referenceHz: 415 }, /referenceHz|Unrecognized/i],
      [{ buyer: { name: 'A', phone: '1' } }, /phone|Unrecognized/i],
      ['a string', /./],
    ]
    for (const [body, message] of cases) {
      const reply = await patch(set.id, office.token, body)
      expect(reply.status, JSON.stringify(body)).toBe(400)
      expect(reply.body.message).toMatch(message)
    }
    expect((await api('/api/sets/not-a-uuid', { method: 'PATCH', token: office.token, body: { model: 'X' } })).status).toBe(400)
    // Past the JSON limit of a signed-in route (1 MB, server/utils/request-limits.ts) the body is refused while it arrives.
    expect((await patch(set.id, office.token, { notes: 'n'.repeat(1_100_000) })).status).toBe(413)
    const form = await api(`/api/sets/${set.id}`, { method: 'PATCH', token: office.token, headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: undefined })
    expect(form.status).toBeGreaterThanOrEqual(400)
    expect(form.status).toBeLessThan(500)
    expect(await editsOf(set.id)).toHaveLength(0)
  })

  it('serialises racing edits of one set: every request succeeds or gets 409, never 500, and the audit matches the end state', async () => {
    const set = await createSet(owner.token)
    const buyers = Array.from({ length: 8 }, (_, i) => `Racer ${i}`)
    const replies = await Promise.all(buyers.map(name => patch(set.id, office.token, { buyer: { name }, notes: `by ${name}` })))
    for (const r of replies) expect([200, 409]).toContain(r.status)
    const after = (await api(`/api/sets/${set.id}`, { token: owner.token })).body
    // Nothing half-saved: the buyer and the notes come from the same request.
    expect(after.notes).toBe(`by ${after.buyerName}`)
    const edits = await editsOf(set.id)
    expect(edits.length).toBe(replies.filter(r => r.status === 200).length)
    // The audited edits chain from the first buyer to the last one, each starting where the one before ended.
    let buyer: string | null = 'A Buyer'
    for (let i = 0; i < edits.length; i++) {
      const next = edits.find(e => e.details.changes.find(c => c.field === 'buyer')?.from === buyer)
      expect(next, `an edit from ${buyer}`).toBeDefined()
      buyer = next!.details.changes.find(c => c.field === 'buyer')!.to
    }
    expect(buyer).toBe(after.buyerName)
  })

  it('gives a serial to only one of two sets racing for it (one 200, one 409)', async () => {
    const a = await createSet(owner.token)
    const b = await createSet(owner.token)
    const serial = `RACE-${Date.now()}`
    const replies = await Promise.all([patch(a.id, office.token, { serial }), patch(b.id, office.token, { serial })])
    expect(replies.map(r => r.status).sort()).toEqual([200, 409])
    const [row] = await testSql()`select count(*)::int as n from sets where serial = ${serial}`
    expect(row!.n).toBe(1)
  })
})
