import { describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { createSet, postStrike, strikeWav } from '../../../support/records'

/** One workshop, two sets; pieces sent to review by two benchmakers and by the owner (unassigned). */
async function queueOfTwoSets() {
  const owner = await newWorkshop('Queue filters')
  const sup = await memberWithRole(owner.token, 'supervisor')
  const ann = await memberWithRole(owner.token, 'benchmaker')
  const ben = await memberWithRole(owner.token, 'benchmaker')
  const first = await createSet(owner.token, { name: 'Set one', fromNote: 'A4', toNote: 'B4', chromatic: false })
  const second = await createSet(owner.token, { name: 'Set two', fromNote: 'C5', toNote: 'C5' })
  async function toReview(token: string, piece: { id: string, targetHz: number }) {
    expect((await postStrike(token, piece.id, strikeWav(piece.targetHz, [1, 4], [0, 0]))).status).toBe(201)
    expect((await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token, body: { to: 'review' } })).status).toBe(200)
  }
  await toReview(ann.token, first.pieces[0])
  await toReview(ben.token, first.pieces[1])
  await toReview(owner.token, second.pieces[0])
  return { owner, sup, ann, ben, first, second }
}

const ids = (body: { id: string }[]) => body.map(p => p.id).sort()

describe('review queue filters', () => {
  it('filters by set and by benchmaker, within the workshop only, and lists the choices', async () => {
    const { sup, ann, ben, first, second } = await queueOfTwoSets()
    const all = await api('/api/review', { token: sup.token })
    expect(all.status).toBe(200)
    expect(all.body).toHaveLength(3)

    const bySet = await api(`/api/review?set=${first.id}`, { token: sup.token })
    expect(ids(bySet.body)).toEqual(ids(first.pieces))
    expect(bySet.body.every((p: { setId: string }) => p.setId === first.id)).toBe(true)

    const byAnn = await api(`/api/review?benchmaker=${ann.userId}`, { token: sup.token })
    expect(byAnn.body.map((p: { id: string }) => p.id)).toEqual([first.pieces[0].id])
    const unassigned = await api('/api/review?benchmaker=none', { token: sup.token })
    expect(unassigned.body.map((p: { id: string }) => p.id)).toEqual([second.pieces[0].id])
    const both = await api(`/api/review?set=${first.id}&benchmaker=${ben.userId}`, { token: sup.token })
    expect(both.body.map((p: { id: string }) => p.id)).toEqual([first.pieces[1].id])

    // Each piece carries the worst cents of its strikes, oldest first (one strike here).
    expect(byAnn.body[0].worstCentsTrail).toHaveLength(1)

    const filters = await api('/api/review/filters', { token: sup.token })
    expect(filters.status).toBe(200)
    expect(filters.body.sets.map((s: { id: string, count: number }) => [s.id, s.count]).sort())
      .toEqual([[first.id, 2], [second.id, 1]].sort())
    expect(filters.body.benchmakers).toEqual(expect.arrayContaining([
      expect.objectContaining({ id: ann.userId, count: 1 }),
      expect.objectContaining({ id: ben.userId, count: 1 }),
      { id: 'none', name: 'Unassigned', count: 1 },
    ]))
  })

  it('never shows another workshop\'s pieces for its set or benchmaker ids', async () => {
    const theirs = await queueOfTwoSets()
    const mine = await newWorkshop('Neighbour')
    const bySet = await api(`/api/review?set=${theirs.first.id}`, { token: mine.token })
    expect(bySet.status).toBe(200)
    expect(bySet.body).toEqual([])
    const byBench = await api(`/api/review?benchmaker=${theirs.ann.userId}`, { token: mine.token })
    expect(byBench.body).toEqual([])
    const filters = await api('/api/review/filters', { token: mine.token })
    expect(filters.body).toEqual({ sets: [], benchmakers: [] })
  })

  it('refuses malformed filters with 400 and a sentence, and benchmakers with 403', async () => {
    const { sup, ann, first, second } = await queueOfTwoSets()
    for (const query of ['set=not-a-uuid', `set=${first.id}&set=${second.id}`, 'benchmaker=everyone', 'group=colour', `set=${'f'.repeat(5000)}`]) {
      const reply = await api(`/api/review?${query}`, { token: sup.token })
      expect(reply.status, query).toBe(400)
      expect(reply.body.message, query).toMatch(/^\w+: [A-Z][^\n]*\.$/)
      expect(JSON.stringify(reply.body), query).not.toMatch(/stack|at \//)
    }
    expect((await api('/api/review?group=set', { token: sup.token })).status).toBe(200)
    expect((await api('/api/review/filters', { token: ann.token })).status).toBe(403)
    expect((await api(`/api/review?set=${first.id}`, { token: ann.token })).status).toBe(403)
  })
})
