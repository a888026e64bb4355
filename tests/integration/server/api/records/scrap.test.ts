import { describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { createSet } from '../../../support/records'

async function twoPieces() {
  const owner = await newWorkshop()
  const supervisor = await memberWithRole(owner.token, 'supervisor')
  const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'B4' })
  return { owner, supervisor, pieces: set.pieces as { id: string }[] }
}

const stageOf = async (token: string, id: string) => (await api(`/api/pieces/${id}`, { token })).body.stage

describe('scrapping a piece', () => {
  it('answers 400 without a reason (or with a blank one) and leaves the piece where it was', async () => {
    const { supervisor, pieces } = await twoPieces()
    const piece = pieces[0]!
    for (const body of [{ to: 'scrapped' }, { to: 'scrapped', reason: '   ' }, { to: 'scrapped', reason: 'no' }]) {
      const reply = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: supervisor.token, body })
      expect(reply.status, JSON.stringify(body)).toBe(400)
      expect(JSON.stringify(reply.body)).toMatch(/reason/i)
    }
    expect(await stageOf(supervisor.token, piece.id)).toBe('blank')
  })

  it('scraps with a reason', async () => {
    const { owner, supervisor, pieces } = await twoPieces()
    const piece = pieces[0]!
    const reply = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: supervisor.token, body: { to: 'scrapped', reason: 'Crack along the grain at the node' } })
    expect(reply.status).toBe(200)
    expect(await stageOf(owner.token, piece.id)).toBe('scrapped')
  })

  it('asks for a reason in a bulk change to scrapped too, and moves none of the pieces without one', async () => {
    const { supervisor, pieces } = await twoPieces()
    const ids = pieces.map(p => p.id)
    const refused = await api('/api/pieces/bulk-stage', { method: 'POST', token: supervisor.token, body: { pieceIds: ids, to: 'scrapped' } })
    expect(refused.status).toBe(400)
    for (const id of ids) expect(await stageOf(supervisor.token, id)).toBe('blank')
    const done = await api('/api/pieces/bulk-stage', { method: 'POST', token: supervisor.token, body: { pieceIds: ids, to: 'scrapped', reason: 'Whole billet checked: shakes' } })
    expect(done.status).toBe(200)
    for (const id of ids) expect(await stageOf(supervisor.token, id)).toBe('scrapped')
  })

  it('still moves to other stages without a reason', async () => {
    const { supervisor, pieces } = await twoPieces()
    const reply = await api(`/api/pieces/${pieces[0]!.id}/stage`, { method: 'POST', token: supervisor.token, body: { to: 'roughed' } })
    expect(reply.status).toBe(200)
  })
})
