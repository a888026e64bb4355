import { execFile } from 'node:child_process'
import { promisify } from 'node:util'
import { describe, expect, it } from 'vitest'
import { api } from '../support/http'
import { approveAll, approvedSet } from '../support/certified-set'

const run = promisify(execFile)

/** `npm run backup:check` against the test cluster; never throws. */
async function backupCheck(env: Record<string, string> = {}) {
  const port = process.env.TW_PG_PORT ?? process.env.TONEWRIGHT_TEST_DB_PORT ?? '54339'
  try {
    const { stdout, stderr } = await run('bash', ['scripts/backup-restore-check.sh'], { env: { ...process.env, TONEWRIGHT_TEST_DB_PORT: port, ...env }, encoding: 'utf8' })
    return { code: 0, stdout, stderr }
  }
  catch (error) {
    const e = error as { code: number, stdout: string, stderr: string }
    return { code: e.code, stdout: e.stdout, stderr: e.stderr }
  }
}

describe('npm run backup:check', () => {
  it('dumps, drops and restores a copy of the test database; a signed certificate still verifies with the same hash', { timeout: 240_000 }, async () => {
    const ctx = await approvedSet({ from: 'C5', to: 'E5' })
    await approveAll(ctx)
    const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })
    expect(signed.status).toBe(201)
    const result = await backupCheck({ TW_BACKUP_CERT_CODE: signed.body.code })
    expect(result.code, result.stderr).toBe(0)
    const verified = /verifies after dump, drop and restore: (\{.*\})/.exec(result.stdout)
    expect(verified, result.stdout).not.toBeNull()
    const after = JSON.parse(verified![1]!)
    expect(after).toEqual({ number: signed.body.number, status: 'valid', hash: expect.stringMatching(/^[0-9a-f]{64}$/), hashMatches: true })
    // The public page gives the same hash from the live database.
    expect((await api(`/api/verify/${signed.body.code}`)).body.hash).toBe(after.hash)
    expect(result.stdout).toMatch(/\d+ tables, \d+ rows restored alike/)
  })

  it('fails with a sentence for a certificate that is not there', { timeout: 120_000 }, async () => {
    const result = await backupCheck({ TW_BACKUP_CERT_CODE: 'no-such-code-000' })
    expect(result.code).not.toBe(0)
    expect(result.stderr).toContain('does not verify before the backup')
  })
})
