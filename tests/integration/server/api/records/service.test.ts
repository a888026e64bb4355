import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../../../support/http'
import { approveAll, approvedSet } from '../../../support/certified-set'
import { testSql } from '../../../support/mail'

type Ctx = Awaited<ReturnType<typeof approvedSet>>
let ctx: Ctx
let first: { id: string, number: string, code: string }
const booking = { kind: 'retune', receivedOn: '2026-11-30', reason: 'Low bars flat after a humid summer', conditions: 'Frame scuffed, bars clean' }

const setOf = async (c: Ctx) => (await api(`/api/sets/${c.set.id}`, { token: c.office.token })).body
const stages = async (c: Ctx) => new Set((await setOf(c)).pieces.map((p: { stage: string }) => p.stage))
const serviceRows = async (setId: string) => (await testSql()`select id, closed_at, certificate_id from service_records where set_id = ${setId}`)

async function certifiedSet() {
  const c = await approvedSet({ from: 'C5', to: 'E5' })
  await approveAll(c)
  const signed = await api(`/api/sets/${c.set.id}/certificates`, { method: 'POST', token: c.supervisor.token })
  expect(signed.status).toBe(201)
  return { c, cert: signed.body as { id: string, number: string, code: string } }
}

describe('service bookings', () => {
  beforeAll(async () => {
    const made = await certifiedSet()
    ctx = made.c
    first = made.cert
  })
  afterAll(async () => {
    await testSql().end()
  })

  it('refuses a set that is not shipped (409) and saves nothing', async () => {
    const early = await api(`/api/sets/${ctx.set.id}/service`, { method: 'POST', token: ctx.office.token, body: booking })
    expect(early.status).toBe(409)
    expect(early.body.message).toMatch(/only a shipped set/i)
    expect(await serviceRows(ctx.set.id)).toHaveLength(0)
    expect(await stages(ctx)).toEqual(new Set(['certified']))
    expect((await api(`/api/sets/${ctx.set.id}/ship`, { method: 'POST', token: ctx.office.token })).status).toBe(200)
  })

  it('refuses other workshops (404), roles without the right (403) and malformed bookings (400)', async () => {
    const other = await newWorkshop('Another workshop')
    expect((await api(`/api/sets/${ctx.set.id}/service`, { method: 'POST', token: other.token, body: booking })).status).toBe(404)
    expect((await api(`/api/sets/${ctx.set.id}/history`, { token: other.token })).status).toBe(404)
    expect((await api(`/api/sets/${ctx.set.id}/service`, { method: 'POST', token: ctx.bench.token, body: booking })).status).toBe(403)
    expect((await api(`/api/sets/${ctx.set.id}/service`, { method: 'POST', token: ctx.supervisor.token, body: booking })).status).toBe(403)
    for (const body of [
      { ...booking, kind: 'polish' },
      { ...booking, receivedOn: '30/11/2026' },
      { ...booking, receivedOn: '2026-02-30' },
      { ...booking, reason: '' },
      { ...booking, reason: 'x'.repeat(1001) },
      { ...booking, conditions: 'x'.repeat(2001) },
      'not json at all',
    ]) {
      const reply = await api(`/api/sets/${ctx.set.id}/service`, { method: 'POST', token: ctx.office.token, body })
      expect(reply.status, JSON.stringify(body).slice(0, 60)).toBe(400)
      expect(reply.body.message).not.toMatch(/at .*\.ts|stack/i)
    }
    expect((await api('/api/sets/not-a-uuid/service', { method: 'POST', token: ctx.office.token, body: booking })).status).toBe(400)
    expect(await serviceRows(ctx.set.id)).toHaveLength(0)
    expect(await stages(ctx)).toEqual(new Set(['shipped']))
  })

  it('two bookings racing: one 201, one 409, one service record; every piece back in tuning, each move audited', async () => {
    const replies = await Promise.all([0, 1].map(() => api(`/api/sets/${ctx.set.id}/service`, { method: 'POST', token: ctx.office.token, body: booking })))
    expect(replies.map(r => r.status).sort()).toEqual([201, 409])
    const booked = replies.find(r => r.status === 201)!.body
    expect(booked).toMatchObject({ kind: 'retune', receivedOn: '2026-11-30', reason: booking.reason, previousCertificateId: first.id, pieceCount: 3 })
    expect(await serviceRows(ctx.set.id)).toHaveLength(1)
    expect(await stages(ctx)).toEqual(new Set(['tuning']))
    const set = await setOf(ctx)
    expect(set.shippedAt).toBeNull()
    const [moves] = await testSql()`select count(*)::int as n from audit_events where action = 'piece.service' and from_state = 'shipped' and to_state = 'tuning' and details->>'serviceId' = ${booked.id}`
    expect(moves!.n).toBe(3)
    // The certificate it came in with stays valid until a new one supersedes it.
    expect((await api(`/api/verify/${first.code}`)).body.status).toBe('valid')
    // The Sets list tells the open visit, for every role that may read sets.
    const listed = (await api('/api/sets', { token: ctx.bench.token })).body.find((s: { id: string }) => s.id === ctx.set.id)
    expect(listed.inService).toEqual({ kind: 'retune', receivedOn: '2026-11-30' })
    const again = await api(`/api/sets/${ctx.set.id}/service`, { method: 'POST', token: ctx.office.token, body: booking })
    expect(again.status).toBe(409)
    expect(again.body.message).toMatch(/already booked in/i)
  })

  it('re-approved and signed: the new certificate supersedes the old, closes the service, and the history tells it all', async () => {
    await approveAll(ctx)
    const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })
    expect(signed.status).toBe(201)
    expect(signed.body.number).not.toBe(first.number)
    const old = (await api(`/api/verify/${first.code}`)).body
    expect(old.status).toBe('superseded')
    expect(old.hashMatches).toBe(true)
    expect(old.supersededBy).toEqual({ number: signed.body.number, code: signed.body.code })
    expect((await api(`/api/verify/${signed.body.code}`)).body.status).toBe('valid')
    const [row] = await serviceRows(ctx.set.id)
    expect(row!.certificate_id).toBe(signed.body.id)
    expect(row!.closed_at).not.toBeNull()
    expect(await stages(ctx)).toEqual(new Set(['certified']))
    expect((await api(`/api/sets/${ctx.set.id}/ship`, { method: 'POST', token: ctx.office.token })).status).toBe(200)
    const history = (await api(`/api/sets/${ctx.set.id}/history`, { token: ctx.bench.token })).body
    expect(history.events.map((e: { kind: string }) => e.kind)).toEqual(['made', 'certified', 'shipped', 'serviced', 'recertified', 'shipped'])
    expect(history.openService).toBeNull()
    expect((await api('/api/sets', { token: ctx.office.token })).body.find((s: { id: string }) => s.id === ctx.set.id).inService).toBeNull()
    const recert = history.events.find((e: { kind: string }) => e.kind === 'recertified')
    expect(recert.text).toContain(`superseding ${first.number}`)
    expect(recert.reason).toContain(booking.reason)
    expect(recert.certificate).toMatchObject({ number: signed.body.number, status: 'valid' })
  })
})
