import { describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../../../support/http'
import { createSet, templateId } from '../../../support/records'

describe('sets', () => {
  it('creates the 52 pieces of a 4.3-octave chromatic A2–C7 marimba in one go', async () => {
    const owner = await newWorkshop()
    // source: common practice — a 4.3-octave marimba spans A2–C7, 52 bars (45 … 96 in MIDI numbers).
    const set = await createSet(owner.token, { fromNote: 'A2', toNote: 'C7', chromatic: true })
    expect(set.pieces).toHaveLength(52)
    expect(set.pieces[0].note).toBe('A2')
    expect(set.pieces.at(-1).note).toBe('C7')
    // source: ISO 16:1975 (A4 = 440 Hz): A2 = 110 Hz, C7 = 2093.005 Hz.
    expect(set.pieces[0].targetHz).toBeCloseTo(110, 6)
    expect(set.pieces.at(-1).targetHz).toBeCloseTo(2093.005, 2)
  })

  it('makes naturals only when not chromatic (A2–C7: 31 bars)', async () => {
    const owner = await newWorkshop()
    // A2, B2, then four octaves of seven naturals (C3–B6), then C7: 2 + 28 + 1.  (common practice)
    const set = await createSet(owner.token, { fromNote: 'A2', toNote: 'C7', chromatic: false })
    expect(set.pieces).toHaveLength(31)
    expect(set.pieces.some((p: { note: string }) => p.note.includes('#'))).toBe(false)
  })

  it('derives targets from the set\'s reference pitch and per-note offsets', async () => {
    const owner = await newWorkshop()
    const set = await createSet(owner.token, { referenceHz: 442, fromNote: 'A4', toNote: 'A4', noteOffsetsCents: { A4: 10 } })
    // 442 Hz raised by 10 cents: 442 · 2^(10/1200).  (definition of the cent)
    expect(set.pieces[0].targetHz).toBeCloseTo(442 * 2 ** (10 / 1200), 9)
  })

  it('gives pieces the template of their register', async () => {
    const owner = await newWorkshop()
    const triple = await templateId(owner.token, 'Marimba bar, triple (1 : 4 : 10)')
    const double = await templateId(owner.token, 'Marimba bar, double (1 : 4)')
    const set = await createSet(owner.token, { fromNote: 'B5', toNote: 'D6', templateId: triple, registers: [{ fromNote: 'C#6', toNote: 'D6', templateId: double }] })
    expect(set.pieces.map((p: { templateName: string }) => p.templateName)).toEqual([
      'Marimba bar, triple (1 : 4 : 10)', 'Marimba bar, triple (1 : 4 : 10)', 'Marimba bar, double (1 : 4)', 'Marimba bar, double (1 : 4)',
    ])
  })

  it('refuses a backwards range, a bad note and a duplicate serial, saving nothing', async () => {
    const owner = await newWorkshop()
    const tid = await templateId(owner.token, 'Xylophone bar (1 : 3)')
    const base = { name: 'S', model: 'M', serial: 'DUP-1', buyer: { name: 'B', email: 'b@example.test' }, referenceHz: 440, fromNote: 'C4', toNote: 'C5', chromatic: true, templateId: tid }
    const backwards = await api('/api/sets', { method: 'POST', token: owner.token, body: { ...base, fromNote: 'C5', toNote: 'C4' } })
    expect(backwards.status).toBe(400)
    expect(backwards.body.message).toMatch(/backwards/)
    const badNote = await api('/api/sets', { method: 'POST', token: owner.token, body: { ...base, fromNote: 'H2' } })
    expect(badNote.status).toBe(400)
    expect(badNote.body.message).toMatch(/C4, F#3 or Bb2/)
    expect((await api('/api/sets', { method: 'POST', token: owner.token, body: base })).status).toBe(201)
    const dup = await api('/api/sets', { method: 'POST', token: owner.token, body: base })
    expect(dup.status).toBe(409)
    const list = await api('/api/sets', { token: owner.token })
    expect(list.body).toHaveLength(1)
  })

  it('lists pieces with filters, sorting and pagination', async () => {
    const owner = await newWorkshop()
    const set = await createSet(owner.token, { fromNote: 'C4', toNote: 'B4' })
    const page1 = await api(`/api/pieces?set=${set.id}&sort=-note&page=1&pageSize=5`, { token: owner.token })
    expect(page1.status).toBe(200)
    expect(page1.body.total).toBe(12)
    expect(page1.body.items.map((p: { note: string }) => p.note)).toEqual(['B4', 'A#4', 'A4', 'G#4', 'G4'])
    const page3 = await api(`/api/pieces?set=${set.id}&sort=-note&page=3&pageSize=5`, { token: owner.token })
    expect(page3.body.items.map((p: { note: string }) => p.note)).toEqual(['C#4', 'C4'])
    const search = await api(`/api/pieces?set=${set.id}&q=F%23`, { token: owner.token })
    expect(search.body.items.map((p: { note: string }) => p.note)).toEqual(['F#4'])
    const none = await api(`/api/pieces?set=${set.id}&stage=review`, { token: owner.token })
    expect(none.body.total).toBe(0)
    const bad = await api('/api/pieces?pageSize=5000', { token: owner.token })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/pageSize/)
  })
})
