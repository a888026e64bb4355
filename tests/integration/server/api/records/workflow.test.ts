import { describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { finishApprovals } from '../../../support/certified-set'
import { createSet, postStrike, strikeWav } from '../../../support/records'

async function pieceInReview(cents: number[]) {
  const owner = await newWorkshop()
  const bench = await memberWithRole(owner.token, 'benchmaker')
  const sup = await memberWithRole(owner.token, 'supervisor')
  const sup2 = await memberWithRole(owner.token, 'supervisor')
  const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
  const piece = set.pieces[0]
  const strike = await postStrike(bench.token, piece.id, strikeWav(piece.targetHz, [1, 4], cents))
  expect(strike.status).toBe(201)
  expect((await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench.token, body: { to: 'review' } })).status).toBe(200)
  return { owner, bench, sup, sup2, piece, strike: strike.body }
}

describe('strikes', () => {
  it('measures an uploaded strike against the piece\'s target and template and stores it', async () => {
    const owner = await newWorkshop()
    const bench = await memberWithRole(owner.token, 'benchmaker')
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const piece = set.pieces[0]
    // A4 = 440 Hz (ISO 16:1975); the synthetic bar is +1.5 ¢ and −2.0 ¢ on the 1 : 4 template.
    const reply = await postStrike(bench.token, piece.id, strikeWav(440, [1, 4], [1.5, -2]), { temperatureC: '', humidityPct: '45' })
    expect(reply.status).toBe(201)
    expect(reply.body.analysis.matches.map((m: { cents: number }) => m.cents)).toEqual([expect.closeTo(1.5, 1), expect.closeTo(-2, 1)])
    expect(reply.body.verdict).toBe('within')
    expect(reply.body.humidityPct).toBe(45)
    const detail = await api(`/api/pieces/${piece.id}`, { token: bench.token })
    expect(detail.body.strikeCount).toBe(1)
    expect(detail.body.latestVerdict).toBe('within')
    expect(detail.body.assigneeId).toBe(bench.userId)
    const audio = await fetch(`${process.env.TW_BASE_URL}/api/strikes/${reply.body.id}/audio`, { headers: { authorization: `Bearer ${bench.token}` } })
    expect(audio.status).toBe(200)
    expect((await audio.arrayBuffer()).byteLength).toBe(44 + 1.5 * 48000 * 2)
  })

  it('refuses what is not audio with 415 and saves nothing', async () => {
    const owner = await newWorkshop()
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const reply = await postStrike(owner.token, set.pieces[0].id, new TextEncoder().encode('this is not a recording'), {}, 'notes.txt')
    expect(reply.status).toBe(415)
    expect(reply.body.message).toMatch(/\.$/)
    const detail = await api(`/api/pieces/${set.pieces[0].id}`, { token: owner.token })
    expect(detail.body.strikeCount).toBe(0)
    expect(detail.body.strikes).toHaveLength(0)
  })

  it('refuses a bad bench temperature in a plain sentence', async () => {
    const owner = await newWorkshop()
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const reply = await postStrike(owner.token, set.pieces[0].id, strikeWav(440, [1, 4], [0, 0]), { temperatureC: 'warm' })
    expect(reply.status).toBe(400)
    expect(reply.body.message).toMatch(/temperature/)
  })

  it('stops a benchmaker sending a piece without strikes to review', async () => {
    const owner = await newWorkshop()
    const bench = await memberWithRole(owner.token, 'benchmaker')
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    expect((await api(`/api/pieces/${set.pieces[0].id}/stage`, { method: 'POST', token: bench.token, body: { to: 'tuning' } })).status).toBe(200)
    const reply = await api(`/api/pieces/${set.pieces[0].id}/stage`, { method: 'POST', token: bench.token, body: { to: 'review' } })
    expect(reply.status).toBe(409)
    expect(reply.body.message).toMatch(/no strike/)
  })
})

describe('approval', () => {
  it('approves a piece whose latest strike is within, and makes it final', async () => {
    const { sup, bench, piece, strike } = await pieceInReview([0.5, 1])
    const ok = await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: sup.token, body: { strikeId: strike.id } })
    expect(ok.status).toBe(200)
    const detail = await api(`/api/pieces/${piece.id}`, { token: sup.token })
    expect(detail.body.stage).toBe('approved')
    expect(detail.body.approvedStrikeId).toBe(strike.id)
    // Approved: the measured numbers can no longer change.
    const again = await postStrike(bench.token, piece.id, strikeWav(piece.targetHz, [1, 4], [9, 9]))
    expect(again.status).toBe(409)
    const stage = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: sup.token, body: { to: 'tuning' } })
    expect(stage.status).toBe(409)
  })

  it('needs an override reason when the latest strike is outside, and records it', async () => {
    const { sup, piece, strike } = await pieceInReview([12, 1])
    expect(strike.verdict).toBe('outside')
    const refused = await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: sup.token, body: { strikeId: strike.id } })
    expect(refused.status).toBe(409)
    expect(refused.body.message).toMatch(/override reason/)
    const ok = await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: sup.token, body: { strikeId: strike.id, overrideReason: 'Buyer asked for a bright fundamental' } })
    expect(ok.status).toBe(200)
    expect(ok.body.overrideReason).toBe('Buyer asked for a bright fundamental')
  })

  it('lets exactly one of two simultaneous approvals through; the other gets 409', async () => {
    const { sup, sup2, piece, strike } = await pieceInReview([0, 0])
    const [a, b] = await Promise.all([
      api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: sup.token, body: { strikeId: strike.id } }),
      api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: sup2.token, body: { strikeId: strike.id } }),
    ])
    expect([a.status, b.status].sort()).toEqual([200, 409])
    const detail = await api(`/api/pieces/${piece.id}`, { token: sup.token })
    expect(detail.body.reviews.filter((r: { decision: string }) => r.decision === 'approve')).toHaveLength(1)
  })

  it('returns a piece for rework; the next strike takes it back to tuning', async () => {
    const { sup, bench, piece } = await pieceInReview([6, 1])
    const ret = await api(`/api/pieces/${piece.id}/return`, { method: 'POST', token: sup.token, body: { comment: 'Fundamental sharp' } })
    expect(ret.status).toBe(200)
    expect((await api(`/api/pieces/${piece.id}`, { token: bench.token })).body.stage).toBe('rework')
    expect((await postStrike(bench.token, piece.id, strikeWav(piece.targetHz, [1, 4], [1, 1]))).status).toBe(201)
    const detail = await api(`/api/pieces/${piece.id}`, { token: bench.token })
    expect(detail.body.stage).toBe('tuning')
    expect(detail.body.reworkCount).toBe(1)
  })

  it('reopens an approval only with a reason, as its own audited action', async () => {
    const { sup, bench, piece, strike } = await pieceInReview([0, 0])
    await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: sup.token, body: { strikeId: strike.id } })
    expect((await api(`/api/pieces/${piece.id}/reopen`, { method: 'POST', token: bench.token, body: { reason: 'Crack found' } })).status).toBe(403)
    expect((await api(`/api/pieces/${piece.id}/reopen`, { method: 'POST', token: sup.token, body: {} })).status).toBe(400)
    const ok = await api(`/api/pieces/${piece.id}/reopen`, { method: 'POST', token: sup.token, body: { reason: 'Hairline crack found at the node' } })
    expect(ok.status).toBe(200)
    const detail = await api(`/api/pieces/${piece.id}`, { token: sup.token })
    expect(detail.body.stage).toBe('tuning')
    expect(detail.body.reviews[0]).toMatchObject({ decision: 'reopen', comment: 'Hairline crack found at the node' })
  })

  it('refuses to approve on a strike that is not the latest', async () => {
    const { sup, bench, piece, strike } = await pieceInReview([0, 0])
    await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench.token, body: { to: 'tuning' } })
    await postStrike(bench.token, piece.id, strikeWav(piece.targetHz, [1, 4], [0.2, 0.2]))
    await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench.token, body: { to: 'review' } })
    const reply = await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: sup.token, body: { strikeId: strike.id } })
    expect(reply.status).toBe(409)
    expect(reply.body.message).toMatch(/newer strike/)
  })

  it('makes a set certifiable once every non-scrapped piece is approved', async () => {
    const owner = await newWorkshop()
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A#4' })
    const [a, b] = set.pieces
    const s = await postStrike(owner.token, a.id, strikeWav(a.targetHz, [1, 4], [0, 0]))
    await api(`/api/pieces/${a.id}/stage`, { method: 'POST', token: owner.token, body: { to: 'review' } })
    await api(`/api/pieces/${a.id}/approve`, { method: 'POST', token: owner.token, body: { strikeId: s.body.id } })
    expect((await api(`/api/sets/${set.id}`, { token: owner.token })).body.certifiable).toBe(false)
    expect((await api(`/api/pieces/${b.id}/stage`, { method: 'POST', token: owner.token, body: { to: 'scrapped', reason: 'Split along the grain' } })).status).toBe(200)
    // Still within its undo window, the approval does not count yet.
    const pending = await api(`/api/sets/${set.id}`, { token: owner.token })
    expect(pending.body).toMatchObject({ certifiable: false, approvedCount: 1, liveCount: 1, pendingApprovalCount: 1 })
    await finishApprovals(set.id)
    const after = await api(`/api/sets/${set.id}`, { token: owner.token })
    expect(after.body).toMatchObject({ certifiable: true, approvedCount: 1, liveCount: 1, pendingApprovalCount: 0 })
  })

  it('moves pieces in bulk all or nothing', async () => {
    const owner = await newWorkshop()
    const set = await createSet(owner.token, { fromNote: 'C4', toNote: 'D4' })
    const ids = set.pieces.map((p: { id: string }) => p.id)
    const ok = await api('/api/pieces/bulk-stage', { method: 'POST', token: owner.token, body: { pieceIds: ids, to: 'roughed' } })
    expect(ok.status).toBe(200)
    expect(ok.body.moved).toBe(3)
    expect((await api('/api/pieces/bulk-stage', { method: 'POST', token: owner.token, body: { pieceIds: ids, to: 'tuning' } })).status).toBe(200)
    // Review needs a strike: only the first piece has one, so the change is refused and none moves.
    expect((await postStrike(owner.token, ids[0], strikeWav(set.pieces[0].targetHz, [1, 4], [0, 0]))).status).toBe(201)
    const review = await api('/api/pieces/bulk-stage', { method: 'POST', token: owner.token, body: { pieceIds: ids, to: 'review' } })
    expect(review.status).toBe(409)
    expect(review.body.message).toMatch(/no strike/)
    const list = await api(`/api/pieces?set=${set.id}`, { token: owner.token })
    expect(list.body.items.map((p: { stage: string }) => p.stage)).toEqual(['tuning', 'tuning', 'tuning'])
  })
})
