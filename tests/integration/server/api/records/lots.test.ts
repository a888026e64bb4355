import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { createSet } from '../../../support/records'
import { testSql } from '../../../support/mail'

let owner: Awaited<ReturnType<typeof newWorkshop>>
let office: { token: string }
let bench: { token: string }
let other: Awaited<ReturnType<typeof newWorkshop>>
const code = () => `L-${randomUUID().slice(0, 8)}`
const wood = () => ({ code: code(), material: 'padauk', species: 'Pterocarpus soyauxii', supplier: 'Harrowby Timber', receivedOn: '2026-10-05', moisturePct: 8.5 })

describe('lots', () => {
  beforeAll(async () => {
    owner = await newWorkshop('Lots workshop')
    office = await memberWithRole(owner.token, 'office')
    bench = await memberWithRole(owner.token, 'benchmaker')
    other = await newWorkshop('Someone else')
  })
  afterAll(async () => {
    await testSql().end()
  })

  it('records, lists and opens a lot; a listed species needs its permit number', async () => {
    // from memory: African padauk (Pterocarpus soyauxii) is not in the CITES appendices; P. erinaceus is.
    const padauk = await api('/api/lots', { method: 'POST', token: office.token, body: wood() })
    expect(padauk.status).toBe(201)
    expect(padauk.body.permitNumber).toBe('')
    // from memory: CITES Appendix II lists Dalbergia spp. (rosewoods), so the trade needs a permit.
    const rosewood = { code: code(), material: 'rosewood', species: 'Dalbergia stevensonii', moisturePct: 9 }
    const refused = await api('/api/lots', { method: 'POST', token: office.token, body: rosewood })
    expect(refused.status).toBe(400)
    expect(refused.body.message).toMatch(/Dalbergia is a listed species.*permit/)
    const kosso = await api('/api/lots', { method: 'POST', token: office.token, body: { ...wood(), species: 'Pterocarpus erinaceus' } })
    expect(kosso.status).toBe(400)
    const ok = await api('/api/lots', { method: 'POST', token: office.token, body: { ...rosewood, permitNumber: 'EX-2026-0417' } })
    expect(ok.status).toBe(201)
    const list = await api('/api/lots', { token: bench.token })
    expect(list.status).toBe(200)
    expect(list.body.map((l: { code: string }) => l.code)).toEqual([ok.body.code, padauk.body.code])
    expect(list.body[0]).toMatchObject({ permitNumber: 'EX-2026-0417', pieceCount: 0, setCount: 0 })
    const one = await api(`/api/lots/${ok.body.id}`, { token: bench.token })
    expect(one.body).toMatchObject({ code: ok.body.code, species: 'Dalbergia stevensonii', pieces: [], sets: [] })
  })

  it('refuses other workshops (404), roles without the right (403) and malformed input (400)', async () => {
    const lot = (await api('/api/lots', { method: 'POST', token: owner.token, body: wood() })).body
    expect((await api(`/api/lots/${lot.id}`, { token: other.token })).status).toBe(404)
    expect((await api(`/api/lots/${lot.id}`, { method: 'PATCH', token: other.token, body: { supplier: 'x' } })).status).toBe(404)
    expect((await api(`/api/lots/${lot.id}/pieces`, { method: 'POST', token: other.token, body: { pieceIds: [randomUUID()] } })).status).toBe(404)
    expect((await api('/api/lots', { method: 'POST', token: bench.token, body: wood() })).status).toBe(403)
    expect((await api(`/api/lots/${lot.id}`, { method: 'PATCH', token: bench.token, body: { supplier: 'x' } })).status).toBe(403)
    expect((await api(`/api/lots/${lot.id}/pieces`, { method: 'POST', token: bench.token, body: { pieceIds: [randomUUID()] } })).status).toBe(403)
    expect((await api('/api/lots/not-a-uuid', { token: owner.token })).status).toBe(400)
    for (const body of [{}, { moisturePct: 150 }, { receivedOn: '5 Oct 2026' }, { code: '' }, { notes: 'x'.repeat(2001) }, 'plain text']) {
      const reply = await api(`/api/lots/${lot.id}`, { method: 'PATCH', token: office.token, body })
      expect(reply.status, JSON.stringify(body).slice(0, 40)).toBe(400)
    }
    const many = Array.from({ length: 501 }, () => randomUUID())
    expect((await api(`/api/lots/${lot.id}/pieces`, { method: 'POST', token: office.token, body: { pieceIds: many } })).status).toBe(400)
    expect((await api(`/api/lots/${lot.id}`, { token: owner.token })).body).toMatchObject({ supplier: 'Harrowby Timber', moisturePct: 8.5 })
  })

  it('edits a lot; an edit that would leave a listed species without a permit is refused and saves nothing', async () => {
    const lot = (await api('/api/lots', { method: 'POST', token: office.token, body: wood() })).body
    const edited = await api(`/api/lots/${lot.id}`, { method: 'PATCH', token: office.token, body: { supplier: 'Harrowby Timber Ltd', moisturePct: 7.9 } })
    expect(edited.status).toBe(200)
    expect(edited.body).toMatchObject({ supplier: 'Harrowby Timber Ltd', moisturePct: 7.9, code: lot.code })
    const listed = await api(`/api/lots/${lot.id}`, { method: 'PATCH', token: office.token, body: { species: 'Dalbergia retusa', supplier: 'changed' } })
    expect(listed.status).toBe(400)
    expect((await api(`/api/lots/${lot.id}`, { token: office.token })).body).toMatchObject({ species: 'Pterocarpus soyauxii', supplier: 'Harrowby Timber Ltd' })
    const [audits] = await testSql()`select count(*)::int as n from audit_events where subject_id = ${lot.id} and action = 'lot.update'`
    expect(audits!.n).toBe(1)
  })

  it('two edits racing to the same code: one 200, one 409', async () => {
    const a = (await api('/api/lots', { method: 'POST', token: office.token, body: wood() })).body
    const b = (await api('/api/lots', { method: 'POST', token: office.token, body: wood() })).body
    const target = code()
    const replies = await Promise.all([a, b].map(l => api(`/api/lots/${l.id}`, { method: 'PATCH', token: office.token, body: { code: target } })))
    expect(replies.map(r => r.status).sort()).toEqual([200, 409])
    const [row] = await testSql()`select count(*)::int as n from lots where code = ${target}`
    expect(row!.n).toBe(1)
  })

  it('records the lot of a set\'s pieces; pieces and their page link to it; another workshop\'s piece changes nothing', async () => {
    const lot = (await api('/api/lots', { method: 'POST', token: office.token, body: wood() })).body
    const set = await createSet(owner.token)
    const ids = set.pieces.map((p: { id: string }) => p.id)
    const foreign = await createSet(other.token)
    const mixed = await api(`/api/lots/${lot.id}/pieces`, { method: 'POST', token: office.token, body: { pieceIds: [...ids, foreign.pieces[0].id] } })
    expect(mixed.status).toBe(404)
    const [none] = await testSql()`select count(*)::int as n from pieces where lot_id = ${lot.id}`
    expect(none!.n).toBe(0)
    const assigned = await api(`/api/lots/${lot.id}/pieces`, { method: 'POST', token: office.token, body: { pieceIds: ids } })
    expect(assigned.status).toBe(200)
    expect(assigned.body.pieceCount).toBe(ids.length)
    const page = (await api(`/api/lots/${lot.id}`, { token: bench.token })).body
    expect(page.sets).toEqual([{ id: set.id, name: set.name, serial: set.serial, pieceCount: ids.length }])
    expect(page.pieces.map((p: { note: string }) => p.note)).toEqual(set.pieces.map((p: { note: string }) => p.note))
    expect((await api(`/api/pieces/${ids[0]}`, { token: bench.token })).body.lot).toMatchObject({ id: lot.id, code: lot.code })
    const listed = (await api(`/api/pieces?set=${set.id}`, { token: bench.token })).body
    expect(listed.items.every((p: { lotCode: string }) => p.lotCode === lot.code)).toBe(true)
    expect((await api('/api/lots', { token: bench.token })).body.find((l: { id: string }) => l.id === lot.id)).toMatchObject({ pieceCount: ids.length, setCount: 1 })
  })
})
