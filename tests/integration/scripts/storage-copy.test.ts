import { execFile } from 'node:child_process'
import { createHash } from 'node:crypto'
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { promisify } from 'node:util'
import { describe, expect, it } from 'vitest'
import { fileStorage } from '../../../server/utils/storage-fs'
import { s3Storage } from '../../../server/utils/storage-s3'
import { fakeBucketConfig, freshBucket, s3Env } from '../support/s3'
import { freePort } from '../support/server'

const run = promisify(execFile)

/** `npm run storage:copy -- ARGS` with the target bucket's NUXT_STORAGE_* settings; never throws. */
async function copy(args: string[], env: Record<string, string>) {
  try {
    const { stdout, stderr } = await run(process.execPath, ['--import', 'tsx', 'scripts/storage-copy.ts', ...args], { env: { ...process.env, ...env }, encoding: 'utf8' })
    return { code: 0, stdout, stderr }
  }
  catch (error) {
    const e = error as { code: number, stdout: string, stderr: string }
    return { code: e.code, stdout: e.stdout, stderr: e.stderr }
  }
}

const sha = (bytes: Uint8Array | null) => (bytes ? createHash('sha256').update(bytes).digest('hex') : null)
const bytesOf = (length: number, seed: number) => Uint8Array.from({ length }, (_, i) => (i * seed + 11) % 251)

describe('npm run storage:copy -- --to s3', () => {
  it('copies a filesystem store, verifies every object, skips what is already there and resumes', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tw-copy-'))
    const store = fileStorage(dir)
    const objects: Record<string, Uint8Array> = {
      'workshops/w1/strikes/p1/s1.wav': bytesOf(2_500_000, 3),
      'workshops/w1/strikes/p1/s2.flac': bytesOf(40_000, 5),
      'workshops/w1/certificates/c1.pdf': bytesOf(120_000, 7),
      'workshops/w2/strikes/p9/s9.mp3': bytesOf(10, 13),
      'pending/strikes/w1/s3.wav': bytesOf(300, 17),
    }
    for (const [key, bytes] of Object.entries(objects)) await store.put(key, bytes, 'application/octet-stream')
    const bucket = await freshBucket('copy')
    const target = s3Storage(bucket)
    // One object is there already (an earlier, interrupted run), one key holds stale bytes.
    await target.put('workshops/w1/strikes/p1/s2.flac', objects['workshops/w1/strikes/p1/s2.flac']!, 'audio/flac')
    await target.put('workshops/w1/certificates/c1.pdf', bytesOf(120_000, 8), 'application/pdf')

    const first = await copy(['--to', 's3', '--from', dir], s3Env(bucket))
    expect(first.code, first.stderr).toBe(0)
    expect(first.stdout).toContain('5 objects, 4 copied')
    expect(first.stdout).toContain('1 skipped')
    expect(first.stdout).toContain('0 failed')
    for (const [key, bytes] of Object.entries(objects)) expect(sha(await target.get(key)), key).toBe(sha(bytes))
    expect((await target.list('')).length).toBe(5)

    // A second run sends nothing again.
    const again = await copy(['--to', 's3', '--from', dir], s3Env(bucket))
    expect(again.code).toBe(0)
    expect(again.stdout).toContain('5 objects, 0 copied (0.0 MB, SHA-256 verified), 5 skipped')

    // A new recording since: only it is copied.
    await store.put('workshops/w1/strikes/p1/s4.wav', bytesOf(999, 19), 'audio/wav')
    const resumed = await copy(['--to', 's3', '--from', dir, '--concurrency', '1'], s3Env(bucket))
    expect(resumed.stdout).toContain('6 objects, 1 copied')
    expect(sha(await target.get('workshops/w1/strikes/p1/s4.wav'))).toBe(sha(bytesOf(999, 19)))
  })

  it('refuses bad arguments and an unreachable bucket with a sentence', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tw-copy-'))
    const bucket = fakeBucketConfig('tw-copy-none')
    const noTarget = await copy(['--from', dir], s3Env(bucket))
    expect(noTarget.code).toBe(2)
    expect(noTarget.stderr).toContain('--to s3')
    expect((await copy(['--to', 'gcs', '--from', dir], s3Env(bucket))).stderr).toContain('the only target is s3')
    expect((await copy(['--to', 's3', '--from', join(dir, 'missing')], s3Env(bucket))).stderr).toContain('is not a folder')
    expect((await copy(['--to', 's3', '--from', dir, '--concurrency', '0'], s3Env(bucket))).code).toBe(2)
    const closed = await copy(['--to', 's3', '--from', dir], s3Env({ ...bucket, endpoint: `http://127.0.0.1:${await freePort()}` }))
    expect(closed.code).toBe(1)
    expect(closed.stderr).toContain('cannot be reached')
    expect(closed.stderr).not.toMatch(/\n\s+at /)
  })
})
