import { describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { createSet, templateId } from '../../../support/records'

describe('ratio templates', () => {
  it('seeds the starter library into every new workshop, each entry with its source', async () => {
    const owner = await newWorkshop()
    const reply = await api('/api/templates', { token: owner.token })
    expect(reply.status).toBe(200)
    const byName = Object.fromEntries(reply.body.map((t: { name: string, current: { partials: { ratio: number }[], source: string } }) => [t.name, t.current]))
    // source: Fletcher & Rossing, The Physics of Musical Instruments (1998), ch. 19 — marimba 1 : 4 : 10, xylophone 1 : 3.
    expect(byName['Marimba bar, triple (1 : 4 : 10)'].partials.map((p: { ratio: number }) => p.ratio)).toEqual([1, 4, 10])
    expect(byName['Xylophone bar (1 : 3)'].partials.map((p: { ratio: number }) => p.ratio)).toEqual([1, 3])
    // source: Rossing, Science of Percussion Instruments (2000) — minor-third bell hum 0.5, prime 1, tierce 1.2, quint 1.5, nominal 2.
    expect(byName['Minor-third bell (hum, prime, tierce, quint, nominal)'].partials.map((p: { ratio: number }) => p.ratio)).toEqual([0.5, 1, 1.2, 1.5, 2])
    expect(byName['Major-third bell (tierce 1.25)'].partials[2].ratio).toBe(1.25)
    // source: Fletcher & Rossing (1998), ch. 18 — timpani 1 : 1.5 : 2 : 2.5.
    expect(byName['Timpani (1 : 1.5 : 2 : 2.5)'].partials.map((p: { ratio: number }) => p.ratio)).toEqual([1, 1.5, 2, 2.5])
    expect(reply.body).toHaveLength(14)
    for (const t of reply.body) expect(t.current.source.length).toBeGreaterThan(10)
  })

  it('makes a new version on edit; existing pieces keep the version they were made with', async () => {
    const owner = await newWorkshop()
    const id = await templateId(owner.token, 'Xylophone bar (1 : 3)')
    const before = await createSet(owner.token, { templateId: id, fromNote: 'C5', toNote: 'C5' })
    const v1 = before.pieces[0].templateVersionId
    const edit = {
      family: 'bar', name: 'Xylophone bar (1 : 3)',
      partials: [{ label: 'fundamental', ratio: 1, toleranceCents: 2, required: true }, { label: 'twelfth', ratio: 3, toleranceCents: 4, required: true }],
      searchWindowCents: 90, referenceTemperatureC: 20, temperatureCoefficientCentsPerC: -0.9, notes: 'Tighter', source: 'common practice',
    }
    const put = await api(`/api/templates/${id}`, { method: 'PUT', token: owner.token, body: edit })
    expect(put.status).toBe(200)
    expect(put.body.currentVersion).toBe(2)
    const history = await api(`/api/templates/${id}`, { token: owner.token })
    expect(history.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1])
    expect(history.body.versions[1].partials[0].toleranceCents).toBe(3)
    const old = await api(`/api/sets/${before.id}`, { token: owner.token })
    expect(old.body.pieces[0].templateVersionId).toBe(v1)
    expect(old.body.pieces[0].templateVersion).toBe(1)
    const after = await createSet(owner.token, { templateId: id, fromNote: 'D5', toNote: 'D5' })
    expect(after.pieces[0].templateVersion).toBe(2)
  })

  it('lets only the owner edit templates, and checks the partial list', async () => {
    const owner = await newWorkshop()
    const sup = await memberWithRole(owner.token, 'supervisor')
    const body = { family: 'bar', name: 'Test bar', partials: [{ label: 'f', ratio: 1, toleranceCents: 3, required: true }] }
    expect((await api('/api/templates', { method: 'POST', token: sup.token, body })).status).toBe(403)
    expect((await api('/api/templates', { method: 'POST', token: owner.token, body })).status).toBe(201)
    const twice = await api('/api/templates', { method: 'POST', token: owner.token, body: { ...body, partials: [body.partials[0], body.partials[0]] } })
    expect(twice.status).toBe(400)
    expect(twice.body.message).toMatch(/same ratio/)
    const empty = await api('/api/templates', { method: 'POST', token: owner.token, body: { ...body, partials: [] } })
    expect(empty.status).toBe(400)
  })
})
