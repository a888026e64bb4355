import { describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { testSql } from '../../../support/mail'
import { createSet, postStrike, strikeWav } from '../../../support/records'

// POST /api/pieces/:id/stage with `via`: the stage table's composite move (review through
// tuning) in one request and one transaction. Stage order from shared/product.md.

/** A roughed piece with one strike, struck by a benchmaker (so it is theirs). */
async function roughedPiece() {
  const owner = await newWorkshop()
  const bench = await memberWithRole(owner.token, 'benchmaker')
  const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
  const piece = set.pieces[0]
  // A4 = 440 Hz (ISO 16:1975); the synthetic bar is 1 : 4, within tolerance.
  expect((await postStrike(bench.token, piece.id, strikeWav(piece.targetHz, [1, 4], [0.5, 1]))).status).toBe(201)
  expect((await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench.token, body: { to: 'roughed' } })).status).toBe(200)
  return { owner, bench, piece }
}

const toReview = { to: 'review', via: 'tuning' }

async function stageOf(token: string, pieceId: string) {
  return (await api(`/api/pieces/${pieceId}`, { token })).body.stage as string
}

async function stageEvents(pieceId: string) {
  return testSql()<{ from_state: string, to_state: string }[]>`
    select from_state, to_state from audit_events where subject_id = ${pieceId} and action = 'piece.stage' order by at`
}

describe('send to review through tuning', () => {
  it('moves a roughed piece to review in one request and audits both steps', async () => {
    const { bench, piece } = await roughedPiece()
    const reply = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench.token, body: toReview })
    expect(reply.status).toBe(200)
    expect(reply.body.stage).toBe('review')
    expect(await stageOf(bench.token, piece.id)).toBe('review')
    // Both steps are written in one transaction (the same timestamp), so their order is not compared.
    const events = (await stageEvents(piece.id)).map(e => `${e.from_state}→${e.to_state}`)
    expect(events.sort()).toEqual(['blank→tuning', 'roughed→tuning', 'tuning→review', 'tuning→roughed'])
  })

  it('makes the one remaining move when the piece is already tuning', async () => {
    const owner = await newWorkshop()
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const piece = set.pieces[0]
    expect((await postStrike(owner.token, piece.id, strikeWav(piece.targetHz, [1, 4], [0, 0]))).status).toBe(201)
    const reply = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: owner.token, body: toReview })
    expect(reply.status).toBe(200)
    expect((await stageEvents(piece.id)).map(e => `${e.from_state}→${e.to_state}`).sort()).toEqual(['blank→tuning', 'tuning→review'])
  })

  it('answers 404 for another workshop\'s piece and moves nothing', async () => {
    const { bench, piece } = await roughedPiece()
    const stranger = await newWorkshop('Another workshop')
    const reply = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: stranger.token, body: toReview })
    expect(reply.status).toBe(404)
    expect(await stageOf(bench.token, piece.id)).toBe('roughed')
  })

  it('answers 403 to the office and to a benchmaker whose piece it is not, and moves nothing', async () => {
    const { owner, piece } = await roughedPiece()
    const office = await memberWithRole(owner.token, 'office')
    const other = await memberWithRole(owner.token, 'benchmaker')
    const byOffice = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: office.token, body: toReview })
    expect(byOffice.status).toBe(403)
    const byOther = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: other.token, body: toReview })
    expect(byOther.status).toBe(403)
    expect(byOther.body.message).toMatch(/someone else/)
    expect(await stageOf(owner.token, piece.id)).toBe('roughed')
  })

  it('refuses a malformed body with 400 in a plain sentence', async () => {
    const { bench, piece } = await roughedPiece()
    for (const body of [{ to: 'review', via: 'roughed' }, { to: 'tuning', via: 'roughed' }, { to: 'review', via: 'polishing' }, { via: 'tuning' }, { to: 'review', via: 7 }]) {
      const reply = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench.token, body })
      expect(reply.status, JSON.stringify(body)).toBe(400)
      expect(typeof reply.body.message).toBe('string')
    }
    const badId = await api('/api/pieces/not-a-piece/stage', { method: 'POST', token: bench.token, body: toReview })
    expect(badId.status).toBe(400)
    expect(await stageOf(bench.token, piece.id)).toBe('roughed')
  })

  it('saves nothing when the second step is refused (no strike yet): the piece stays roughed', async () => {
    const owner = await newWorkshop()
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const piece = set.pieces[0]
    expect((await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: owner.token, body: { to: 'roughed' } })).status).toBe(200)
    const reply = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: owner.token, body: toReview })
    expect(reply.status).toBe(409)
    expect(reply.body.message).toMatch(/no strike/)
    expect(await stageOf(owner.token, piece.id)).toBe('roughed')
    expect((await stageEvents(piece.id)).map(e => e.to_state)).toEqual(['roughed'])
  })

  it('lets one of two racing requests through and answers the other 409', async () => {
    const { bench, piece } = await roughedPiece()
    const replies = await Promise.all([0, 1].map(() => api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench.token, body: toReview })))
    expect(replies.map(r => r.status).sort()).toEqual([200, 409])
    expect(replies.find(r => r.status === 409)!.body.message).toMatch(/already in review/)
    expect((await stageEvents(piece.id)).filter(e => e.to_state === 'review')).toHaveLength(1)
  })

  it('refuses a piece past review (approved) with 409', async () => {
    const { owner, bench, piece } = await roughedPiece()
    expect((await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench.token, body: toReview })).status).toBe(200)
    const detail = await api(`/api/pieces/${piece.id}`, { token: owner.token })
    expect((await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: owner.token, body: { strikeId: detail.body.strikes[0].id } })).status).toBe(200)
    const reply = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: owner.token, body: toReview })
    expect(reply.status).toBe(409)
    expect(await stageOf(owner.token, piece.id)).toBe('approved')
  })
})
