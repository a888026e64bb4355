import { beforeAll, describe, expect, it } from 'vitest'
import { solveBarModes } from '../../../../../shared/barModel/solveBarModes'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { createSet } from '../../../support/records'

// A rosewood-like blank. from memory: dense rosewoods are about 1000 kg/m³ with E near 20 GPa along the grain.
const BLANK = { lengthMm: 420, widthMm: 58, thicknessMm: 24, massG: 584.64, species: 'rosewood' }
const RHO = (BLANK.massG / 1000) / (0.42 * 0.058 * 0.024)
// source: f₁ = (4.7300² / 2π L²) √(E t² / 12 ρ), uniform free–free bar (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1)
const f1For = (eGPa: number) => (4.7300 ** 2 / (2 * Math.PI * 0.42 ** 2)) * Math.sqrt((eGPa * 1e9 * 0.024 ** 2) / (12 * RHO))

let owner = ''
let bench = ''
let office = ''
let lotId = ''
beforeAll(async () => {
  const w = await newWorkshop('Blank records')
  owner = w.token
  bench = (await memberWithRole(owner, 'benchmaker')).token
  office = (await memberWithRole(owner, 'office')).token
  const lot = await api('/api/lots', { method: 'POST', token: office, body: { code: 'RW-7', material: 'wood', species: 'rosewood' } })
  expect(lot.status).toBe(201)
  lotId = lot.body.id
})

const record = (body: unknown, token = bench) => api('/api/blanks', { method: 'POST', token, body })

describe('POST and GET /api/blanks', () => {
  it('records graded blanks against their lot and says where each stands among the earlier ones of its species', async () => {
    const first = await record({ ...BLANK, f1Hz: f1For(18), decayDbPerS: 30, lotId })
    expect(first.status).toBe(201)
    expect(first.body).toMatchObject({ lotId, species: 'rosewood', rank: 'usable', standing: { earlier: 0, lessStiff: 0, percentile: null } })
    expect(first.body.youngsModulusGPa).toBeCloseTo(18, 2)
    const second = await record({ ...BLANK, f1Hz: f1For(24), decayDbPerS: 30, lotId })
    expect(second.status).toBe(201)
    // E/ρ 24 against one earlier blank of 18: stiffer than all of them (checked by hand: 1 of 1, 100 %).
    expect(second.body.standing).toEqual({ earlier: 1, lessStiff: 1, percentile: 100 })
    expect(second.body.rank).toBe('select')
    const list = await api('/api/blanks?species=rosewood', { token: office })
    expect(list.status).toBe(200)
    expect(list.body.map((b: { id: string }) => b.id)).toEqual([second.body.id, first.body.id])
    expect((await api('/api/blanks?species=padauk', { token: office })).body).toEqual([])
  })

  it('refuses another workshop\'s lot (404), a role that may not strike (403) and malformed bodies (400), recording nothing', async () => {
    const other = await newWorkshop('Elsewhere')
    const theirs = await api('/api/lots', { method: 'POST', token: other.token, body: { code: 'X-1', material: 'wood' } })
    expect((await record({ ...BLANK, f1Hz: 600, lotId: theirs.body.id })).status).toBe(404)
    expect((await record({ ...BLANK, f1Hz: 600 }, office)).status).toBe(403)
    for (const body of [{ ...BLANK }, { ...BLANK, f1Hz: 600, species: 'cheese' }, { ...BLANK, f1Hz: 600, lotId: 'x' }, { ...BLANK, f1Hz: 600, massG: 1e5 }]) {
      const reply = await record(body)
      expect(reply.status).toBe(400)
      expect(reply.body.message).toMatch(/\.$/)
    }
    expect((await api('/api/blanks?species=cheese', { token: bench })).status).toBe(400)
    expect((await api('/api/blanks', { token: bench })).body).toHaveLength(2)
  })
})

describe('POST /api/blanks/:id/piece', () => {
  it('turns a blank into a piece: its lot, species and measured material, at the length for the note', async () => {
    const set = await createSet(owner, { fromNote: 'A4', toNote: 'B4' })
    const [piece, second] = set.pieces
    const blank = (await record({ ...BLANK, f1Hz: f1For(20), lotId })).body
    const made = await api(`/api/blanks/${blank.id}/piece`, { method: 'POST', token: bench, body: { pieceId: piece.id } })
    expect(made.status).toBe(200)
    const geometry = await api(`/api/pieces/${piece.id}/geometry`, { token: bench })
    expect(geometry.body).toMatchObject({ source: 'piece', material: 'rosewood' })
    expect(geometry.body.geometry.densityKgM3).toBeCloseTo(RHO, 6)
    expect(geometry.body.geometry.youngsModulusGPa).toBeCloseTo(20, 2)
    // The model's first mode of that geometry is the note: A4 = 440 Hz (ISO 16:1975), within 2 ¢.
    const f1 = solveBarModes(geometry.body.geometry, { modes: 1 }).frequenciesHz[0]!
    expect(Math.abs(1200 * Math.log2(f1 / 440))).toBeLessThan(2)
    expect((await api(`/api/pieces/${piece.id}`, { token: bench })).body.lotId).toBe(lotId)

    expect((await api(`/api/blanks/${blank.id}/piece`, { method: 'POST', token: bench, body: { pieceId: second.id } })).status).toBe(409)
    const other = await newWorkshop('Elsewhere')
    expect((await api(`/api/blanks/${blank.id}/piece`, { method: 'POST', token: other.token, body: { pieceId: piece.id } })).status).toBe(404)
    expect((await api(`/api/blanks/${blank.id}/piece`, { method: 'POST', token: office, body: { pieceId: piece.id } })).status).toBe(403)
    expect((await api(`/api/blanks/${blank.id}/piece`, { method: 'POST', token: bench, body: { pieceId: 'nope' } })).status).toBe(400)
  })

  it('gives a piece one blank when two are turned into it at once', async () => {
    const set = await createSet(owner, { fromNote: 'C5', toNote: 'C5' })
    const piece = set.pieces[0]
    const [a, b] = await Promise.all([record({ ...BLANK, f1Hz: f1For(20) }), record({ ...BLANK, f1Hz: f1For(21) })])
    const replies = await Promise.all([a, b].map(x => api(`/api/blanks/${x.body.id}/piece`, { method: 'POST', token: bench, body: { pieceId: piece.id } })))
    expect(replies.map(r => r.status).sort()).toEqual([200, 409])
    const list = (await api('/api/blanks', { token: bench })).body as { pieceId: string | null }[]
    expect(list.filter(x => x.pieceId === piece.id)).toHaveLength(1)
  })
})

describe('GET /api/blanks?lotId=', () => {
  it('lists one lot\'s blanks, nothing for another workshop\'s lot, and 400 for a malformed id', async () => {
    const other = await api('/api/lots', { method: 'POST', token: office, body: { code: `PD-${Date.now()}`, material: 'wood', species: 'padauk' } })
    const inLot = await record({ ...BLANK, f1Hz: f1For(19), lotId: other.body.id })
    expect(inLot.status).toBe(201)
    const listed = await api(`/api/blanks?lotId=${other.body.id}`, { token: office })
    expect(listed.status).toBe(200)
    expect(listed.body.map((b: { id: string }) => b.id)).toEqual([inLot.body.id])
    const elsewhere = await newWorkshop('Lot filter elsewhere')
    expect((await api(`/api/blanks?lotId=${other.body.id}`, { token: elsewhere.token })).body).toEqual([])
    const bad = await api('/api/blanks?lotId=RW-7', { token: office })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/lot id/)
  })
})
