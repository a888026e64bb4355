import { afterAll, describe, expect, it } from 'vitest'
import { APPROVAL_UNDO_WINDOW_S } from '../../../../../shared/records/approvalWindow'
import { approveAll, approvedSet } from '../../../support/certified-set'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { testSql } from '../../../support/mail'
import { createSet, postStrike, strikeWav } from '../../../support/records'

afterAll(async () => {
  await testSql().end()
})

async function pieceInReview() {
  const owner = await newWorkshop('Undo desk')
  const bench = await memberWithRole(owner.token, 'benchmaker')
  const sup = await memberWithRole(owner.token, 'supervisor')
  const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
  const piece = set.pieces[0]
  const strike = await postStrike(bench.token, piece.id, strikeWav(piece.targetHz, [1, 4], [0, 0]))
  expect(strike.status).toBe(201)
  expect((await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench.token, body: { to: 'review' } })).status).toBe(200)
  return { owner, bench, sup, set, piece, strikeId: strike.body.id as string }
}

/** What an undo must put back, read straight from the database. */
async function pieceState(pieceId: string) {
  const [row] = await testSql()`select stage, approved_strike_id, approved_at, approval_final_at, updated_at from pieces where id = ${pieceId}`
  const reviews = await testSql()`select id, decision from reviews where piece_id = ${pieceId} order by created_at`
  const audits = await testSql()`select action from audit_events where subject_id = ${pieceId} order by at, action`
  return { row, reviews, audits: audits.map(a => a.action as string) }
}

const undo = (pieceId: string, token: string) => api(`/api/pieces/${pieceId}/approve/undo`, { method: 'POST', token, body: {} })
const approve = (pieceId: string, token: string, strikeId: string) => api(`/api/pieces/${pieceId}/approve`, { method: 'POST', token, body: { strikeId } })
/** Moves the approval's undo window into the past, as the clock would. */
const expire = (pieceId: string) => testSql()`update pieces set approval_final_at = now() - interval '1 second' where id = ${pieceId}`

describe('undoing an approval', () => {
  it('is pending for the window, then undone exactly: stage, review row, place in the queue; both audited', async () => {
    const { sup, piece, strikeId } = await pieceInReview()
    const before = await pieceState(piece.id)
    const approved = await approve(piece.id, sup.token, strikeId)
    expect(approved.status).toBe(200)
    const pending = await pieceState(piece.id)
    expect(pending.row!.stage).toBe('approved')
    // The window is counted on the database's clock from the approval itself (source: issue 13, "an Undo for 10 s").
    expect(pending.row!.approval_final_at.getTime() - pending.row!.approved_at.getTime()).toBe(APPROVAL_UNDO_WINDOW_S * 1000)
    expect(new Date(approved.body.undoUntil).getTime()).toBe(pending.row!.approval_final_at.getTime())
    expect((await api('/api/review', { token: sup.token })).body).toEqual([])

    const undone = await undo(piece.id, sup.token)
    expect(undone.status).toBe(200)
    expect(undone.body).toEqual({ id: piece.id, stage: 'review' })
    const after = await pieceState(piece.id)
    expect(after.row).toEqual(before.row)
    expect(after.reviews).toEqual(before.reviews)
    expect(after.audits.filter(a => !before.audits.includes(a)).sort()).toEqual(['piece.approve', 'piece.approve.undo'])
    expect((await api('/api/review', { token: sup.token })).body.map((p: { id: string }) => p.id)).toEqual([piece.id])

    // Approved again, the piece can be undone again: the window belongs to each approval.
    expect((await approve(piece.id, sup.token, strikeId)).status).toBe(200)
    expect((await undo(piece.id, sup.token)).status).toBe(200)
  })

  it('refuses a benchmaker (403) and another workshop (404), changing nothing', async () => {
    const { bench, sup, piece, strikeId } = await pieceInReview()
    // Signed up first: the window is short and signing up hashes a password.
    const stranger = await newWorkshop('Stranger')
    expect((await approve(piece.id, sup.token, strikeId)).status).toBe(200)
    const pending = await pieceState(piece.id)
    const byBench = await undo(piece.id, bench.token)
    expect(byBench.status).toBe(403)
    const byStranger = await undo(piece.id, stranger.token)
    expect(byStranger.status).toBe(404)
    expect(byStranger.body.message).toMatch(/No such piece/)
    expect(await pieceState(piece.id)).toEqual(pending)
    expect((await undo('not-a-piece-id', sup.token)).status).toBe(400)
  })

  it('answers 409 after the window, for a piece never approved, and for a second undo, changing nothing', async () => {
    const { sup, piece, strikeId } = await pieceInReview()
    const never = await undo(piece.id, sup.token)
    expect(never.status).toBe(409)
    expect(never.body.message).toMatch(/no approval to undo/)

    expect((await approve(piece.id, sup.token, strikeId)).status).toBe(200)
    expect((await undo(piece.id, sup.token)).status).toBe(200)
    const twice = await undo(piece.id, sup.token)
    expect(twice.status).toBe(409)

    expect((await approve(piece.id, sup.token, strikeId)).status).toBe(200)
    await expire(piece.id)
    const final = await pieceState(piece.id)
    const late = await undo(piece.id, sup.token)
    expect(late.status).toBe(409)
    expect(late.body.message).toBe(`This approval is final: it could be undone for ${APPROVAL_UNDO_WINDOW_S} seconds only. Reopen the piece with a reason instead.`)
    expect(await pieceState(piece.id)).toEqual(final)
  })

  it('lets one of two racing undos through, and one of an undo racing a reopen; the other gets 409', async () => {
    const { sup, owner, piece, strikeId } = await pieceInReview()
    expect((await approve(piece.id, sup.token, strikeId)).status).toBe(200)
    const undos = await Promise.all([undo(piece.id, sup.token), undo(piece.id, owner.token)])
    expect(undos.map(r => r.status).sort()).toEqual([200, 409])
    const state = await pieceState(piece.id)
    expect(state.row!.stage).toBe('review')
    expect(state.audits.filter(a => a === 'piece.approve.undo')).toHaveLength(1)

    expect((await approve(piece.id, sup.token, strikeId)).status).toBe(200)
    const [undone, reopened] = await Promise.all([
      undo(piece.id, sup.token),
      api(`/api/pieces/${piece.id}/reopen`, { method: 'POST', token: owner.token, body: { reason: 'Chip found on the edge' } }),
    ])
    expect([undone.status, reopened.status].sort()).toEqual([200, 409])
    expect((await pieceState(piece.id)).row!.stage).toBe(undone.status === 200 ? 'review' : 'tuning')
  })

  it('a second approval while one is pending gets 409 and leaves it undoable', async () => {
    const { sup, owner, piece, strikeId } = await pieceInReview()
    expect((await approve(piece.id, sup.token, strikeId)).status).toBe(200)
    const second = await approve(piece.id, owner.token, strikeId)
    expect(second.status).toBe(409)
    expect(second.body.message).toMatch(/already approved/)
    expect((await undo(piece.id, sup.token)).status).toBe(200)
    expect((await pieceState(piece.id)).reviews).toEqual([])
  })
})

describe('a pending approval is not final for certificates', () => {
  it('refuses to sign while an approval can be undone, signs once it is final, and the set says so', async () => {
    const ctx = await approvedSet({ from: 'C5', to: 'D5' })
    await approveAll(ctx)
    const [first] = ctx.set.pieces as { id: string, note: string }[]
    await testSql()`update pieces set approval_final_at = now() + interval '30 seconds' where id = ${first!.id}`
    const set = await api(`/api/sets/${ctx.set.id}`, { token: ctx.supervisor.token })
    expect(set.body).toMatchObject({ certifiable: false, pendingApprovalCount: 1 })
    const early = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token, body: {} })
    expect(early.status).toBe(409)
    expect(early.body.message).toBe(`${first!.note} was approved moments ago and can still be undone; sign in a few seconds.`)
    const [{ n }] = await testSql()`select count(*)::int as n from certificates where set_id = ${ctx.set.id}`
    expect(n).toBe(0)
    expect((await pieceState(first!.id)).row!.stage).toBe('approved')

    await expire(first!.id)
    const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token, body: {} })
    expect(signed.status).toBe(201)
    // Certified: nothing to undo any more.
    expect((await undo(first!.id, ctx.supervisor.token)).status).toBe(409)
  })
})

describe('returning for rework', () => {
  it('needs a reason: missing, blank or too long is 400 and nothing is saved', async () => {
    const { sup, piece } = await pieceInReview()
    const before = await pieceState(piece.id)
    for (const body of [{}, { comment: '   ' }, { comment: 'x'.repeat(1001) }, { comment: 42 }]) {
      const reply = await api(`/api/pieces/${piece.id}/return`, { method: 'POST', token: sup.token, body })
      expect(reply.status, JSON.stringify(body).slice(0, 40)).toBe(400)
      expect(reply.body.message).toMatch(/rework|at most/)
    }
    expect(await pieceState(piece.id)).toEqual(before)
    const ok = await api(`/api/pieces/${piece.id}/return`, { method: 'POST', token: sup.token, body: { comment: '  Dress the chip at the near end  ' } })
    expect(ok.status).toBe(200)
    expect(ok.body.comment).toBe('Dress the chip at the near end')
  })
})
