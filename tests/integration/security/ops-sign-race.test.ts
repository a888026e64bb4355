// Class: races and double submits answer 409, never 500, and never do the thing twice —
// signing one set in parallel gives one certificate; re-issuing is its own action with a reason.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../support/http'
import { approveAll, approvedSet } from '../support/certified-set'
import { testSql } from '../support/mail'

let ctx: Awaited<ReturnType<typeof approvedSet>>

beforeAll(async () => {
  ctx = await approvedSet({ from: 'C5', to: 'E5' })
  await approveAll(ctx)
})
afterAll(async () => {
  await testSql().end()
})

const validCount = async (setId: string) =>
  (await testSql()`select count(*)::int as n from certificates where set_id = ${setId} and status = 'valid'`)[0]!.n as number

describe('signing races (class: races answer 409 and never do the thing twice)', () => {
  it('five parallel signings of one set: one 201, four 409 with a plain sentence, one certificate', async () => {
    const replies = await Promise.all(Array.from({ length: 5 }, () => api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })))
    expect(replies.map(r => r.status).sort()).toEqual([201, 409, 409, 409, 409])
    for (const r of replies.filter(r => r.status === 409)) expect(r.body.message).toMatch(/already has a valid certificate|signed a moment ago/)
    const [row] = await testSql()`select count(*)::int as n from certificates where set_id = ${ctx.set.id}`
    expect(row!.n).toBe(1)
    const [audits] = await testSql()`select count(*)::int as n from audit_events where action = 'certificate.sign' and details->>'setId' = ${ctx.set.id}`
    expect(audits!.n).toBe(1)
  })

  it('signing again later is refused too: replacing a certificate is the re-issue action', async () => {
    const again = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.owner.token })
    expect(again.status).toBe(409)
    expect(again.body.message).toMatch(/re-issue that certificate with a reason/)
    expect(await validCount(ctx.set.id)).toBe(1)
  })

  it('re-issue needs a reason, the right role and the own workshop', async () => {
    const [cert] = (await api(`/api/certificates?set=${ctx.set.id}`, { token: ctx.office.token })).body
    const path = `/api/certificates/${cert.id}/reissue`
    expect((await api(path, { method: 'POST', token: ctx.supervisor.token, body: {} })).status).toBe(400)
    expect((await api(path, { method: 'POST', token: ctx.supervisor.token, body: { reason: 'x' } })).status).toBe(400)
    expect((await api(path, { method: 'POST', token: ctx.office.token, body: { reason: 'Buyer name misspelt' } })).status).toBe(403)
    expect((await api(path, { method: 'POST', token: ctx.bench.token, body: { reason: 'Buyer name misspelt' } })).status).toBe(403)
    const other = await newWorkshop('Elsewhere Chimes')
    expect((await api(path, { method: 'POST', token: other.token, body: { reason: 'Buyer name misspelt' } })).status).toBe(404)
    expect((await api('/api/certificates/not-a-uuid/reissue', { method: 'POST', token: ctx.supervisor.token, body: { reason: 'Buyer name misspelt' } })).status).toBe(400)
    expect(await validCount(ctx.set.id)).toBe(1)
  })

  it('three parallel re-issues of one certificate: one new certificate, the others 409', async () => {
    const [cert] = (await api(`/api/certificates?set=${ctx.set.id}`, { token: ctx.office.token })).body
    const replies = await Promise.all(Array.from({ length: 3 }, () =>
      api(`/api/certificates/${cert.id}/reissue`, { method: 'POST', token: ctx.supervisor.token, body: { reason: 'Reference pitch corrected to 442 Hz' } })))
    expect(replies.map(r => r.status).sort()).toEqual([201, 409, 409])
    for (const r of replies.filter(r => r.status === 409)) expect(r.body.message).toMatch(/already been superseded|signed a moment ago/)
    const created = replies.find(r => r.status === 201)!.body
    const list = (await api(`/api/certificates?set=${ctx.set.id}`, { token: ctx.office.token })).body as { number: string, status: string, reissueReason: string | null }[]
    expect(list.map(c => c.status)).toEqual(['valid', 'superseded'])
    expect(list[0]).toMatchObject({ number: created.number, reissueReason: 'Reference pitch corrected to 442 Hz' })
    const [audit] = await testSql()`select reason from audit_events where action = 'certificate.reissue' and subject_id = ${cert.id}`
    expect(audit!.reason).toBe('Reference pitch corrected to 442 Hz')
  })

  it('the database allows one valid certificate per set even when the service is bypassed', async () => {
    const [cert] = await testSql()`select * from certificates where set_id = ${ctx.set.id} and status = 'valid'`
    await expect(testSql()`insert into certificates (workshop_id, set_id, number, code, content, content_hash, pdf_key, signer_name, signed_at)
      values (${cert!.workshop_id}, ${cert!.set_id}, 'TW-1999-9999', 'racingracingrace', '{}'::jsonb, ${cert!.content_hash}, 'x.pdf', 'x', now())`).rejects.toThrow(/certificates_set_valid_key/)
  })
})
