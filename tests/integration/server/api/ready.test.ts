import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { api } from '../../support/http'
import { fakeBucketConfig, s3Env } from '../../support/s3'
import { freePort, startServer, type ExtraServer } from '../../support/server'

const started: ExtraServer[] = []
afterAll(async () => {
  await Promise.all(started.map(s => s.stop()))
})

describe('GET /api/ready', () => {
  it('answers 200 when PostgreSQL and the storage folder answer', async () => {
    const ready = await api('/api/ready')
    expect(ready.status).toBe(200)
    expect(ready.body).toEqual({ ready: true, db: true, storage: true })
  })

  it('answers 503 (not 500) when the bucket cannot be reached, while /api/health stays 200', async () => {
    const server = await startServer(s3Env({ ...fakeBucketConfig('tw-ready'), endpoint: `http://127.0.0.1:${await freePort()}` }))
    started.push(server)
    const ready = await api('/api/ready', { baseUrl: server.baseUrl })
    expect(ready.status).toBe(503)
    expect(ready.body).toEqual({ ready: false, db: true, storage: false })
    expect((await api('/api/health', { baseUrl: server.baseUrl })).status).toBe(200)
  })

  it('answers 503 when the storage folder is not a folder', async () => {
    const file = join(mkdtempSync(join(tmpdir(), 'tw-ready-')), 'file')
    writeFileSync(file, 'x')
    const server = await startServer({ NUXT_STORAGE_DIR: file })
    started.push(server)
    const ready = await api('/api/ready', { baseUrl: server.baseUrl })
    expect(ready.status).toBe(503)
    expect(ready.body.storage).toBe(false)
  })

  it('a server on the s3 driver without a bucket, or on an unknown driver, refuses to start with a sentence', async () => {
    await expect(startServer({ NUXT_STORAGE_DRIVER: 's3', NUXT_STORAGE_BUCKET: '' })).rejects.toThrow(/NUXT_STORAGE_BUCKET names no bucket/)
    await expect(startServer({ NUXT_STORAGE_DRIVER: 'ftp' })).rejects.toThrow(/use fs .* or s3/)
  })
})
