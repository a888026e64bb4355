import { execFile } from 'node:child_process'
import { mkdtemp, mkdir, readdir, readFile, rm, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { promisify } from 'node:util'
import { afterAll, describe, expect, it } from 'vitest'
import { createDatabase } from '../../../server/database/client'
import { outboxIdOf, workshopCaughtAttachment, workshopCaughtMail } from '../../../server/utils/mailbox'
import { api, BASE_URL, newWorkshop, uniqueEmail } from '../support/http'
import { MAIL_DIR, until, waitForMailTo } from '../support/mail'
import { OUTPUT_DIR, startBuiltServer } from './support'

// Class guarded here: development-only features never reach a production start.
const { db, client } = createDatabase(process.env.NUXT_DATABASE_URL!, { max: 2 })
afterAll(() => client.end())
const run = promisify(execFile)

async function filesUnder(dir: string): Promise<string[]> {
  const entries = await readdir(dir, { withFileTypes: true, recursive: true })
  return entries.filter(e => e.isFile() && /\.(m?js|json)$/.test(e.name)).map(e => join(e.parentPath, e.name))
}

describe('development-only features never reach a production start', () => {
  it('the Mailbox screen and its API answer 404 in the production build, signed in or not', async () => {
    const owner = await newWorkshop('Dev-only probe')
    for (const path of ['/api/dev/mailbox', '/api/dev/mailbox/2026-01-01T00-00-00-000Z-abcdef12/x.pdf']) {
      expect((await api(path, { token: owner.token })).status).toBe(404)
      expect((await api(path)).status).toBe(404)
    }
    const page = await fetch(`${BASE_URL}/mailbox`, { headers: { cookie: `auth.token=${owner.token}`, accept: 'text/html' }, redirect: 'manual' })
    expect(page.status).toBe(404)
    expect(await page.text()).not.toContain('mail catcher')
  })

  it('the production bundle contains neither the Mailbox page nor its routes', async () => {
    const files = [...await filesUnder(join(OUTPUT_DIR, 'server', 'chunks')), ...await filesUnder(join(OUTPUT_DIR, 'public', '_nuxt'))]
    expect(files.length).toBeGreaterThan(10)
    const hits: string[] = []
    for (const file of files) {
      const text = await readFile(file, 'utf8')
      if (text.includes('/api/dev/mailbox') || text.includes('mail catcher caught')) hits.push(file)
    }
    expect(hits).toEqual([])
  })

  it('refuses to start production with NUXT_PUBLIC_DEV_MAILBOX switched on, saying why', async () => {
    const { code, output } = await startBuiltServer({ NUXT_PUBLIC_DEV_MAILBOX: 'true', NUXT_AUTH_SECRET: 'a-long-enough-test-secret-123' })
    expect(code).toBe(1)
    expect(output).toMatch(/Mailbox is for development only/)
    expect(output).toMatch(/npm run mailbox/)
  })

  it('even the development Mailbox shows a workshop only the mail its own outbox sent', async () => {
    const a = await newWorkshop('Mail of workshop A')
    const b = await newWorkshop('Mail of workshop B')
    const toA = uniqueEmail('invitee-a')
    const toB = uniqueEmail('invitee-b')
    expect((await api('/api/team/invitations', { method: 'POST', token: a.token, body: { email: toA, role: 'office' } })).status).toBe(201)
    expect((await api('/api/team/invitations', { method: 'POST', token: b.token, body: { email: toB, role: 'office' } })).status).toBe(201)
    // A password reset belongs to an account, not a workshop: no workshop's Mailbox shows it.
    expect((await api('/api/auth/forgot-password', { method: 'POST', body: { email: a.email } })).status).toBe(200)
    const mailA = await waitForMailTo(toA)
    const mailB = await waitForMailTo(toB)
    const reset = await waitForMailTo(a.email)
    const seenByA = await workshopCaughtMail(db, MAIL_DIR, a.workshopId)
    expect(seenByA.map(m => m.id)).toContain(mailA.id)
    expect(seenByA.map(m => m.id)).not.toContain(mailB.id)
    expect(seenByA.map(m => m.id)).not.toContain(reset.id)
    expect(seenByA.every(m => outboxIdOf(m) !== null)).toBe(true)
    const seenByB = await workshopCaughtMail(db, MAIL_DIR, b.workshopId)
    expect(seenByB.map(m => m.id)).toEqual([mailB.id])
    // Another workshop's message by its id: nothing, even with a real file name.
    expect(await workshopCaughtAttachment(db, MAIL_DIR, b.workshopId, mailA.id, 'anything.pdf')).toBeNull()
    expect(await workshopCaughtAttachment(db, MAIL_DIR, a.workshopId, '../../etc', 'passwd')).toBeNull()
  })

  it('`npm run mailbox` lists caught mail newest first, prints one message and saves its attachments', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'tw-mailbox-'))
    try {
      const write = async (id: string, subject: string, attachments: { filename: string, contentType: string, size: number, file: string }[] = []) => {
        await writeFile(join(dir, `${id}.json`), JSON.stringify({ id, receivedAt: `${id.slice(0, 10)}T10:00:00.000Z`, from: 'a@example.test', to: ['b@example.test'], subject, text: `Body of ${subject}`, html: '', attachments }))
      }
      await write('2026-03-01T10-00-00-000Z-aaaaaaaa', 'Older message')
      await mkdir(join(dir, '2026-03-02T10-00-00-000Z-bbbbbbbb'))
      await writeFile(join(dir, '2026-03-02T10-00-00-000Z-bbbbbbbb', 'TW-1.pdf'), '%PDF-1.7 test')
      await write('2026-03-02T10-00-00-000Z-bbbbbbbb', 'Newer message', [{ filename: 'TW-1.pdf', contentType: 'application/pdf', size: 13, file: '2026-03-02T10-00-00-000Z-bbbbbbbb/TW-1.pdf' }])
      const cli = (...args: string[]) => run(process.execPath, ['--import', 'tsx', 'scripts/mailbox.ts', '--dir', dir, ...args])
      const list = (await cli()).stdout
      expect(list.indexOf('Newer message')).toBeGreaterThan(-1)
      expect(list.indexOf('Newer message')).toBeLessThan(list.indexOf('Older message'))
      expect((await cli('show', '2')).stdout).toContain('Body of Older message')
      expect((await cli('show', '2026-03-02T10-00-00-000Z-bbbbbbbb')).stdout).toContain('Attached: TW-1.pdf')
      const saved = join(dir, 'out')
      await cli('save', '1', saved)
      expect(await readFile(join(saved, 'TW-1.pdf'), 'utf8')).toBe('%PDF-1.7 test')
      await expect(cli('show', '9')).rejects.toMatchObject({ stderr: expect.stringMatching(/no message 9/) })
    }
    finally {
      await rm(dir, { recursive: true, force: true })
    }
  })

  it('the real catcher folder reads with `npm run mailbox` too', async () => {
    const owner = await newWorkshop('Mailbox CLI check')
    const to = uniqueEmail('cli')
    await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { email: to, role: 'benchmaker' } })
    const message = await until('the invitation', async () => (await waitForMailTo(to)))
    const shown = (await run(process.execPath, ['--import', 'tsx', 'scripts/mailbox.ts', '--dir', MAIL_DIR, 'show', message.id])).stdout
    expect(shown).toContain(to)
    expect(shown).toContain(message.subject)
  })
})
