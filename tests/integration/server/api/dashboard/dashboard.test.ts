import { afterAll, describe, expect, it } from 'vitest'
import { finishApprovals } from '../../../support/certified-set'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { testSql } from '../../../support/mail'
import { createSet, postStrike, strikeWav } from '../../../support/records'

afterAll(async () => {
  await testSql().end()
})

describe('GET /api/dashboard', () => {
  it('counts "this week" from Monday 00:00 in the workshop\'s time zone', async () => {
    const owner = await newWorkshop('Week desk')
    for (const timeZone of ['Pacific/Auckland', 'America/Los_Angeles', 'UTC']) {
      expect((await api('/api/workshops/current/settings', { method: 'PATCH', token: owner.token, body: { timeZone } })).status).toBe(200)
      const reply = await api('/api/dashboard', { token: owner.token })
      expect(reply.status).toBe(200)
      // source: PostgreSQL's date_trunc('week', …) (ISO weeks from Monday) on the local time, taken back to an instant in the same zone.
      const [ref] = await testSql()`select date_trunc('week', now() at time zone ${timeZone}) at time zone ${timeZone} as start`
      expect(new Date(reply.body.weekStartsAt).getTime(), timeZone).toBe((ref!.start as Date).getTime())
    }
  })

  it('does not count an approval still in its undo window as approved, and counts it once final', async () => {
    const owner = await newWorkshop('Pending desk')
    const sup = await memberWithRole(owner.token, 'supervisor')
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const piece = set.pieces[0]!
    const strike = await postStrike(owner.token, piece.id, strikeWav(piece.targetHz, [1, 4], [0, 0]))
    expect(strike.status).toBe(201)
    expect((await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: owner.token, body: { to: 'review' } })).status).toBe(200)
    expect((await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: sup.token, body: { strikeId: strike.body.id } })).status).toBe(200)

    const pending = (await api('/api/dashboard', { token: owner.token })).body
    expect(pending).toMatchObject({ approvedPieces: 0, firstPassYield: null, strikesPerApprovedPiece: null, pendingApprovals: 1 })
    const pendingSet = pending.sets.find((s: { id: string }) => s.id === set.id)
    expect(pendingSet).toMatchObject({ approvedCount: 0, pendingApprovalCount: 1, certifiable: false, byStage: { review: 1 } })
    expect(pendingSet.byStage.approved).toBeUndefined()

    await finishApprovals(set.id)
    const final = (await api('/api/dashboard', { token: owner.token })).body
    expect(final).toMatchObject({ approvedPieces: 1, firstPassYield: 1, strikesPerApprovedPiece: 1, pendingApprovals: 0 })
    expect(final.sets.find((s: { id: string }) => s.id === set.id)).toMatchObject({ approvedCount: 1, certifiable: true, byStage: { approved: 1 } })
  })
})
