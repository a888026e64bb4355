import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api, memberOnTemporaryPassword, newWorkshop } from '../../../support/http'
import { approveAll, approvedSet } from '../../../support/certified-set'
import { testSql } from '../../../support/mail'
import { csvRecords, parseCsv } from '../../../../support/csv'

type Ctx = Awaited<ReturnType<typeof approvedSet>>
let ctx: Ctx
let stranger: Awaited<ReturnType<typeof newWorkshop>>
let first: { id: string, number: string, code: string }

const csvOf = (setId: string, token: string) => fetch(`${process.env.TW_BASE_URL ?? 'http://127.0.0.1:3100'}/api/sets/${setId}/export.csv`, { headers: { authorization: `Bearer ${token}` } })

describe('the office: CSV export, edits after signing, re-issue summary, mail preview, search, timelines', () => {
  beforeAll(async () => {
    // C5–E5 naturals: three bars, each struck once, tuned exactly to its 1 : 4 template.
    ctx = await approvedSet({ from: 'C5', to: 'E5' })
    stranger = await newWorkshop('Elsewhere')
  })
  afterAll(async () => {
    await testSql().end()
  })

  it('exports a set not yet struck: one row per piece and template partial, units in the header', async () => {
    const reply = await csvOf(ctx.set.id, ctx.office.token)
    expect(reply.status).toBe(200)
    expect(reply.headers.get('content-type')).toMatch(/^text\/csv/)
    expect(reply.headers.get('content-disposition')).toMatch(/^attachment; filename="tonewright-[\w.-]+-results\.csv"$/)
    const [header, ...rows] = parseCsv(await reply.text())
    expect(header).toEqual(expect.arrayContaining(['target_hz', 'measured_hz', 'deviation_cents', 'tolerance_cents', 'decay_db_per_s', 't60_s', 'stage', 'measured_at_utc']))
    // Three pieces × two tuned partials of the 1 : 4 template.  (common practice: a marimba bar's first two bending modes tuned 1 : 4)
    expect(rows).toHaveLength(6)
    const records = csvRecords(await (await csvOf(ctx.set.id, ctx.office.token)).text())
    // source: ISO 16:1975 with the set's A4 = 442 Hz: C5 = 442 · 2^(3/12) = 525.630 Hz; its second tuned partial 4 × that.
    expect(Number(records[0]!.target_hz)).toBeCloseTo(525.630, 3)
    expect(Number(records[1]!.target_hz)).toBeCloseTo(2102.518, 3)
    expect(records.every(r => r.measured_hz === '' && r.result === 'not measured')).toBe(true)
  })

  it('exports measured partials after the strikes, and refuses the bench (403), another workshop (404) and a bad id (400)', async () => {
    await approveAll(ctx)
    const records = csvRecords(await (await csvOf(ctx.set.id, ctx.owner.token)).text())
    expect(records).toHaveLength(6)
    for (const r of records) {
      expect(r.stage).toBe('approved')
      expect(r.strike).toBe('approved')
      // The synthetic bars sit on their targets; the engine finds them within a cent.  (synthetic signal with a known answer)
      expect(Math.abs(Number(r.deviation_cents))).toBeLessThan(1)
      expect(Number(r.measured_hz)).toBeCloseTo(Number(r.target_hz), 0)
      expect(r.measured_at_utc).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/)
      expect(Number(r.decay_db_per_s)).toBeGreaterThan(0)
    }
    // The synthesis decays the fundamental at 12 dB/s and the second partial at 30 dB/s (tests/integration/support/certified-set.ts); T60 = 60 / rate.  (definition of T60)
    expect(Number(records[0]!.decay_db_per_s)).toBeCloseTo(12, 0)
    expect(Number(records[0]!.t60_s)).toBeCloseTo(5, 0)
    expect((await csvOf(ctx.set.id, ctx.bench.token)).status).toBe(403)
    expect((await csvOf(ctx.set.id, stranger.token)).status).toBe(404)
    expect((await api('/api/sets/nope/export.csv', { token: ctx.office.token })).status).toBe(400)
  })

  it('guards cells a spreadsheet would run as formulas', async () => {
    expect((await api(`/api/sets/${ctx.set.id}`, { method: 'PATCH', token: ctx.office.token, body: { serial: '=HYPERLINK("http://x.test","go")' } })).status).toBe(200)
    const text = await (await csvOf(ctx.set.id, ctx.office.token)).text()
    const records = csvRecords(text)
    // source: OWASP, "CSV Injection": a leading apostrophe keeps the cell text.
    expect(records[0]!.set_serial).toBe('\'=HYPERLINK("http://x.test","go")')
    expect(text).not.toMatch(/(^|,)=HYPERLINK/m)
    expect((await api(`/api/sets/${ctx.set.id}`, { method: 'PATCH', token: ctx.office.token, body: { serial: ctx.set.serial } })).status).toBe(200)
  })

  it('keeps what a signed certificate froze when the set is edited, and a re-issue says what changed', async () => {
    const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })
    expect(signed.status).toBe(201)
    first = signed.body
    const edited = await api(`/api/sets/${ctx.set.id}`, { method: 'PATCH', token: ctx.office.token, body: { buyer: { name: 'Robin Ashdown' } } })
    expect(edited.status).toBe(200)
    const verified = await api(`/api/verify/${first.code}`)
    expect(verified.body.hashMatches).toBe(true)
    const [row] = await testSql()`select content->'buyer'->>'name' as buyer from certificates where id = ${first.id}`
    expect(row!.buyer).toBe('Dana Whitcombe')
    const listed = (await api('/api/certificates', { token: ctx.office.token })).body
    expect(listed[0]).toMatchObject({ number: first.number, buyerName: 'Dana Whitcombe', changes: [] })

    const reissued = await api(`/api/certificates/${first.id}/reissue`, { method: 'POST', token: ctx.supervisor.token, body: { reason: 'The buyer\'s name was mistyped' } })
    expect(reissued.status).toBe(201)
    expect(reissued.body.changes).toEqual([{ field: 'buyer', from: 'Dana Whitcombe', to: 'Robin Ashdown' }])
    const after = (await api('/api/certificates', { token: ctx.office.token })).body
    expect(after[0]).toMatchObject({ number: reissued.body.number, buyerName: 'Robin Ashdown', changes: [{ field: 'buyer', from: 'Dana Whitcombe', to: 'Robin Ashdown' }] })
    expect(after[1]).toMatchObject({ number: first.number, status: 'superseded', buyerName: 'Dana Whitcombe' })
  })

  it('previews the e-mail the sender would send, without sending it; office and owner only', async () => {
    const current = (await api('/api/certificates', { token: ctx.office.token })).body[0]
    const before = (await api(`/api/sets/${ctx.set.id}/mail`, { token: ctx.office.token })).body.length
    const preview = await api(`/api/certificates/${current.id}/mail-preview`, { token: ctx.office.token })
    expect(preview.status).toBe(200)
    expect(preview.body.to).toBe(ctx.buyerEmail)
    expect(preview.body.subject).toContain(current.number)
    expect(preview.body.text).toContain('Dear Robin Ashdown,')
    expect(preview.body.text).toContain(`/verify/${current.code}`)
    expect(preview.body.attachment).toBe(`${current.number}.pdf`)
    const other = await api(`/api/certificates/${current.id}/mail-preview?to=stores%40example.test`, { token: ctx.owner.token })
    expect(other.body.to).toBe('stores@example.test')
    expect((await api(`/api/sets/${ctx.set.id}/mail`, { token: ctx.office.token })).body).toHaveLength(before)

    expect((await api(`/api/certificates/${current.id}/mail-preview`, { token: ctx.supervisor.token })).status).toBe(403)
    expect((await api(`/api/certificates/${current.id}/mail-preview`, { token: ctx.bench.token })).status).toBe(403)
    expect((await api(`/api/certificates/${current.id}/mail-preview`, { token: stranger.token })).status).toBe(404)
    expect((await api(`/api/certificates/${current.id}/mail-preview?to=nobody`, { token: ctx.office.token })).status).toBe(400)
    expect((await api('/api/certificates/123/mail-preview', { token: ctx.office.token })).status).toBe(400)
    const superseded = await api(`/api/certificates/${first.id}/mail-preview`, { token: ctx.office.token })
    expect(superseded.status).toBe(409)
    expect(superseded.body.message).toContain(current.number)
  })

  it('searches certificates by buyer (frozen or current), serial and number', async () => {
    const search = async (q: string) => ((await api(`/api/certificates?q=${encodeURIComponent(q)}`, { token: ctx.office.token })).body as { number: string }[]).map(c => c.number).sort()
    const current = (await api('/api/certificates', { token: ctx.office.token })).body[0].number as string
    const both = [first.number, current].sort()
    // The first certificate froze the old buyer; the re-issue and the set now carry the new one.
    expect(await search('whitcombe')).toEqual([first.number])
    expect(await search('ROBIN')).toEqual(both)
    expect(await search(ctx.set.serial)).toEqual(both)
    expect(await search(first.number)).toEqual([first.number])
    expect(await search('no such buyer')).toEqual([])
    // % and _ are letters here, not wildcards.
    expect(await search('%')).toEqual([])
    expect((await api(`/api/certificates?q=${'x'.repeat(81)}`, { token: ctx.office.token })).status).toBe(400)
    expect((await api('/api/certificates?q=whitcombe', { token: stranger.token })).body).toEqual([])
  })

  it('tells a set\'s and a piece\'s audit trail in plain words, newest first, paged', async () => {
    const timeline = await api(`/api/sets/${ctx.set.id}/timeline?pageSize=50`, { token: ctx.bench.token })
    expect(timeline.status).toBe(200)
    const lines = (timeline.body.items as { who: string, what: string, at: string }[]).map(i => `${i.who} ${i.what}`)
    expect(lines).toContain('A office changed buyer: Dana Whitcombe → Robin Ashdown')
    expect(lines.some(l => /^A supervisor re-issued certificate TW-\d{4}-\d{4} as TW-\d{4}-\d{4} \(changed: buyer: Dana Whitcombe → Robin Ashdown\)$/.test(l))).toBe(true)
    expect(lines.at(-1)).toBe('A office entered the set with 3 pieces')
    const times = (timeline.body.items as { at: string }[]).map(i => Date.parse(i.at))
    expect([...times].sort((a, b) => b - a)).toEqual(times)
    const page2 = await api(`/api/sets/${ctx.set.id}/timeline?pageSize=2&page=2`, { token: ctx.office.token })
    expect(page2.body.total).toBe(timeline.body.total)
    expect(page2.body.items.map((i: { id: string }) => i.id)).toEqual(timeline.body.items.slice(2, 4).map((i: { id: string }) => i.id))

    const piece = ctx.set.pieces[0] as { id: string }
    const trail = await api(`/api/pieces/${piece.id}/timeline`, { token: ctx.bench.token })
    expect(trail.status).toBe(200)
    const words = (trail.body.items as { what: string }[]).map(i => i.what)
    // The piece's trail carries the signing and re-issue of its set's certificates.
    expect(words.filter(w => /^signed certificate TW-/.test(w))).toHaveLength(2)
    expect(words.some(w => /^re-issued certificate/.test(w))).toBe(true)
    expect(words).not.toContain(expect.stringMatching(/^queued certificate/))
    expect(words).toContain('approved the piece')
    expect(words).toContain('moved the piece from tuning to review')
  })

  it('refuses timelines to another workshop (404), a member still on a temporary password (403) and malformed paging (400)', async () => {
    const piece = ctx.set.pieces[0] as { id: string }
    for (const path of [`/api/sets/${ctx.set.id}/timeline`, `/api/pieces/${piece.id}/timeline`]) {
      expect((await api(path, { token: stranger.token })).status).toBe(404)
      expect((await api(`${path}?page=0`, { token: ctx.office.token })).status).toBe(400)
      expect((await api(`${path}?pageSize=500`, { token: ctx.office.token })).status).toBe(400)
      expect((await api(`${path}?page=two`, { token: ctx.office.token })).status).toBe(400)
    }
    const temporary = await memberOnTemporaryPassword(ctx.owner.token, 'office')
    expect((await api(`/api/sets/${ctx.set.id}/timeline`, { token: temporary.token })).status).toBe(403)
    expect((await api('/api/sets/xyz/timeline', { token: ctx.office.token })).status).toBe(400)
  })
})
