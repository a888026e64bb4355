// Class: nothing is half-saved or left dangling after a crash — a certificate's PDF is
// rendered by a job after the signing transaction; "PDF pending" until it is stored;
// revoked and superseded certificates carry their mark on every page; mail waits for
// the PDF and never carries a superseded certificate.
import { execFileSync } from 'node:child_process'
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api, newWorkshop, uniqueEmail } from '../support/http'
import { approveAll, approvedSet } from '../support/certified-set'
import { waitForPdf } from '../support/certificates'
import { mailTo, testSql, until, waitForMailTo } from '../support/mail'

let ctx: Awaited<ReturnType<typeof approvedSet>>
let first: { id: string, number: string }
const OUT = join('test-results', 'certificates')

function pageTexts(bytes: Buffer, name: string) {
  const file = join(OUT, name)
  writeFileSync(file, bytes)
  const pages = Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [file], { encoding: 'utf8' }))![1])
  return Array.from({ length: pages }, (_, i) => execFileSync('pdftotext', ['-f', String(i + 1), '-l', String(i + 1), '-layout', file, '-'], { encoding: 'utf8' }))
}

/** Keeps a certificate's PDF pending: a job id the sweep does not replace for ten minutes. */
const holdPdf = (id: string) => testSql()`update certificates set pdf_status = 'pending', pdf_job_id = 'held-by-test', pdf_requested_at = now() where id = ${id}`
const releasePdf = (id: string) => testSql()`update certificates set pdf_job_id = null where id = ${id}`
const mailRow = async (id: string) => (await testSql()`select status, last_error, attempts from mail_messages where id = ${id}`)[0]!

beforeAll(async () => {
  mkdirSync(OUT, { recursive: true })
  ctx = await approvedSet({ from: 'C5', to: 'G5' })
  await approveAll(ctx)
})
afterAll(async () => {
  await testSql().end()
})

describe('certificate PDF outside the transaction (class: nothing half-saved or dangling)', () => {
  it('signing commits the frozen content and answers "pending"; a job stores the PDF afterwards', async () => {
    const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })
    expect(signed.status).toBe(201)
    expect(signed.body.pdfStatus).toBe('pending')
    first = signed.body
    const [row] = await testSql()`select content_hash, content->>'number' as number from certificates where id = ${first.id}`
    expect(row!.number).toBe(first.number)
    const pages = pageTexts(await waitForPdf(ctx.office.token, first.id), 'ops-valid.pdf')
    for (const text of pages) {
      expect(text).toContain(first.number)
      expect(text).not.toMatch(/REVOKED|SUPERSEDED/)
    }
    const [ready] = await testSql()`select pdf_status, pdf_job_id from certificates where id = ${first.id}`
    expect(ready).toEqual({ pdf_status: 'ready', pdf_job_id: null })
  })

  it('while the PDF is pending: the route answers 202 with a sentence, the list says pending, and the e-mail waits for it', async () => {
    await holdPdf(first.id)
    const pending = await api(`/api/certificates/${first.id}/pdf`, { token: ctx.office.token })
    expect(pending.status).toBe(202)
    expect(pending.headers.get('retry-after')).toBe('2')
    expect(pending.body.message).toBe(`The PDF of certificate ${first.number} is still being prepared; try again in a few seconds.`)
    expect((await api(`/api/certificates/${first.id}/pdf?paper=letter`, { token: ctx.office.token })).status).toBe(202)
    const listed = (await api(`/api/certificates?set=${ctx.set.id}`, { token: ctx.office.token })).body
    expect(listed[0].pdfStatus).toBe('pending')
    const other = await newWorkshop('Pending elsewhere')
    expect((await api(`/api/certificates/${first.id}/pdf`, { token: other.token })).status).toBe(404)

    const address = uniqueEmail('waits')
    const queued = await api(`/api/certificates/${first.id}/send`, { method: 'POST', token: ctx.office.token, body: { to: address } })
    expect(queued.status).toBe(202)
    await new Promise(r => setTimeout(r, 5000))
    expect(await mailTo(address)).toHaveLength(0)
    expect((await mailRow(queued.body.id)).status).toBe('queued')
    await releasePdf(first.id)
    const message = await waitForMailTo(address, 60_000)
    expect(message.attachments.map(a => a.filename)).toEqual([`${first.number}.pdf`])
    await until('sent', async () => (await mailRow(queued.body.id)).status === 'sent')
    expect((await mailRow(queued.body.id)).attempts).toBe(1)
  })

  it('re-issuing marks the old certificate SUPERSEDED on every page; it is never mailed, not even from the queue', async () => {
    // An e-mail of the old certificate waits for its PDF while the certificate is superseded.
    await holdPdf(first.id)
    const address = uniqueEmail('stale')
    const queued = await api(`/api/certificates/${first.id}/send`, { method: 'POST', token: ctx.office.token, body: { to: address } })
    expect(queued.status).toBe(202)
    const second = await api(`/api/certificates/${first.id}/reissue`, { method: 'POST', token: ctx.supervisor.token, body: { reason: 'Buyer organisation renamed' } })
    expect(second.status).toBe(201)
    await releasePdf(first.id)
    const failed = await until('the stale e-mail refused', async () => {
      const row = await mailRow(queued.body.id)
      return row.status === 'failed' ? row : null
    }, 60_000)
    expect(failed.last_error).toBe(`Certificate ${first.number} was superseded before this e-mail went out, so it was not sent.`)
    expect(failed.attempts).toBe(0)

    const old = pageTexts(await waitForPdf(ctx.office.token, first.id), 'ops-superseded.pdf')
    expect(old.length).toBeGreaterThanOrEqual(1)
    for (const text of old) expect(text).toContain('SUPERSEDED')
    const letter = pageTexts(await waitForPdf(ctx.office.token, first.id, '?paper=letter'), 'ops-superseded-letter.pdf')
    for (const text of letter) expect(text).toContain('SUPERSEDED')
    const current = pageTexts(await waitForPdf(ctx.office.token, second.body.id), 'ops-reissued.pdf')
    for (const text of current) expect(text).not.toMatch(/REVOKED|SUPERSEDED/)
    expect(current[0]).toContain(`Supersedes certificate ${first.number}`)

    const refused = await api(`/api/certificates/${first.id}/send`, { method: 'POST', token: ctx.office.token, body: {} })
    expect(refused.status).toBe(409)
    expect(refused.body.message).toBe(`Certificate ${first.number} has been superseded by ${second.body.number}; send the current certificate instead.`)
    await new Promise(r => setTimeout(r, 2000))
    expect(await mailTo(address)).toHaveLength(0)
    first = second.body
  })

  it('revoking re-renders the PDF with REVOKED on every page', async () => {
    const revoked = await api(`/api/certificates/${first.id}/revoke`, { method: 'POST', token: ctx.supervisor.token, body: { reason: 'Bar E5 cracked in transit' } })
    expect(revoked.status).toBe(200)
    const [row] = await testSql()`select pdf_status from certificates where id = ${first.id}`
    expect(['pending', 'ready']).toContain(row!.pdf_status)
    const pages = await until('the revoked rendering', async () => {
      const texts = pageTexts(await waitForPdf(ctx.office.token, first.id), 'ops-revoked.pdf')
      return texts.every(t => t.includes('REVOKED')) ? texts : null
    }, 60_000, 500)
    for (const text of pages) expect(text).toContain(first.number)
    const [key] = await testSql()`select pdf_key from certificates where id = ${first.id}`
    expect(key!.pdf_key).toMatch(/-revoked\.pdf$/)
  })
})
