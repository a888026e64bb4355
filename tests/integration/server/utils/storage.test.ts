import { createHash } from 'node:crypto'
import { existsSync, mkdtempSync, readdirSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { dirname, join } from 'node:path'
import type { Readable } from 'node:stream'
import { describe, expect, it } from 'vitest'
import { InvalidStorageKey, type BlobStorage } from '../../../../server/utils/storage'
import { fileStorage } from '../../../../server/utils/storage-fs'
import { s3Storage } from '../../../../server/utils/storage-s3'
import { fakeBucketConfig, freshBucket } from '../../support/s3'
import { freePort } from '../../support/server'

// One contract for every storage driver: the filesystem under a fresh folder, and an
// S3-compatible bucket on the fake scripts/test.sh started (a fresh bucket per test).

interface Driver { name: string, make: () => Promise<{ storage: BlobStorage, everything: () => Promise<string[]> }> }

const DRIVERS: Driver[] = [
  {
    name: 'fs',
    make: async () => {
      const root = join(mkdtempSync(join(tmpdir(), 'tw-contract-')), 'store')
      const storage = fileStorage(root)
      return { storage, everything: async () => (existsSync(root) ? readdirSync(dirname(root), { recursive: true }).map(String) : []) }
    },
  },
  {
    name: 's3',
    make: async () => {
      const storage = s3Storage(await freshBucket('contract'))
      return { storage, everything: async () => (await storage.list('')).map(o => o.key) }
    },
  },
]

async function readAll(stream: Readable | null) {
  if (!stream) return null
  const chunks: Buffer[] = []
  for await (const chunk of stream) chunks.push(Buffer.from(chunk))
  return new Uint8Array(Buffer.concat(chunks))
}

/** A short fingerprint of bytes: comparing millions of elements one by one is slow in expect. */
const digest = (bytes: Uint8Array | null) => (bytes ? `${bytes.byteLength}:${createHash('sha256').update(bytes).digest('hex')}` : null)

/** Bytes that differ at every position, so a range off by one shows. */
const pattern = (length: number) => Uint8Array.from({ length }, (_, i) => (i * 7 + (i >> 8)) % 256)

const HOSTILE_KEYS = [
  '../escape.wav', 'a/../../escape.wav', 'workshops/w/../../../escape.wav', '/etc/passwd', '/escape.wav',
  'a/%2e%2e/%2e%2e/escape.wav', '%2e%2e%2fescape.wav', '..%2Fescape.wav', 'a\\..\\..\\escape.wav', 'a/./b.wav', 'a//b.wav', '', '.hidden',
]

describe.each(DRIVERS)('storage contract: $name', (driver) => {
  it('puts, gets, heads and overwrites an object', async () => {
    const { storage } = await driver.make()
    const bytes = pattern(1000)
    await storage.put('workshops/w1/strikes/p1/s1.wav', bytes, 'audio/wav')
    expect(await storage.get('workshops/w1/strikes/p1/s1.wav')).toEqual(bytes)
    expect((await storage.head('workshops/w1/strikes/p1/s1.wav'))?.size).toBe(1000)
    await storage.put('workshops/w1/strikes/p1/s1.wav', new Uint8Array([9, 8, 7]), 'audio/wav')
    expect(await storage.get('workshops/w1/strikes/p1/s1.wav')).toEqual(new Uint8Array([9, 8, 7]))
  })

  it('streams the whole object and any byte range of it, ends inclusive', async () => {
    const { storage } = await driver.make()
    const bytes = pattern(3 * 1024 * 1024 + 17)
    await storage.put('a/long.wav', bytes, 'audio/wav')
    expect(digest(await readAll(await storage.stream('a/long.wav')))).toBe(digest(bytes))
    expect(await readAll(await storage.stream('a/long.wav', { start: 0, end: 0 }))).toEqual(bytes.subarray(0, 1))
    expect(digest(await readAll(await storage.stream('a/long.wav', { start: 1_000_000, end: 2_000_123 })))).toBe(digest(bytes.subarray(1_000_000, 2_000_124)))
    expect(await readAll(await storage.stream('a/long.wav', { start: bytes.length - 5, end: bytes.length - 1 }))).toEqual(bytes.subarray(bytes.length - 5))
  })

  it('answers null (never an error) for a missing key, and deleting one is no error', async () => {
    const { storage } = await driver.make()
    expect(await storage.get('a/none.wav')).toBeNull()
    expect(await storage.head('a/none.wav')).toBeNull()
    expect(await storage.stream('a/none.wav')).toBeNull()
    expect(await storage.stream('a/none.wav', { start: 0, end: 3 })).toBeNull()
    expect(await storage.move('a/none.wav', 'b/none.wav')).toBe(false)
    await expect(storage.delete('a/none.wav')).resolves.toBeUndefined()
  })

  it('deletes and moves', async () => {
    const { storage } = await driver.make()
    await storage.put('pending/strikes/w/s.wav', new Uint8Array([1, 2]), 'audio/wav')
    await storage.put('pending/strikes/w/t.wav', new Uint8Array([3]), 'audio/wav')
    expect(await storage.move('pending/strikes/w/s.wav', 'workshops/w/strikes/p/s.wav')).toBe(true)
    expect(await storage.get('pending/strikes/w/s.wav')).toBeNull()
    expect(await storage.get('workshops/w/strikes/p/s.wav')).toEqual(new Uint8Array([1, 2]))
    await storage.delete('pending/strikes/w/t.wav')
    expect(await storage.get('pending/strikes/w/t.wav')).toBeNull()
  })

  it('lists by folder prefix only what lies under it', async () => {
    const { storage } = await driver.make()
    for (const key of ['w/a/1.wav', 'w/a/deep/2.wav', 'w/ab/3.wav', 'w/b/4.wav', 'x/5.wav']) await storage.put(key, new Uint8Array([1]), 'audio/wav')
    expect((await storage.list('w/a/')).map(o => o.key).sort()).toEqual(['w/a/1.wav', 'w/a/deep/2.wav'])
    expect((await storage.list('w/')).map(o => o.key).sort()).toEqual(['w/a/1.wav', 'w/a/deep/2.wav', 'w/ab/3.wav', 'w/b/4.wav'])
    expect(await storage.list('nothing/here/')).toEqual([])
    const [one] = await storage.list('x/')
    expect(Math.abs(one!.modifiedAt.getTime() - Date.now())).toBeLessThan(5 * 60_000)
  })

  it.each(HOSTILE_KEYS)('refuses the key %j in every call and writes nothing', async (key) => {
    const { storage, everything } = await driver.make()
    await storage.put('inside/ok.wav', new Uint8Array([1]), 'audio/wav')
    const before = await everything()
    await expect(storage.put(key, new Uint8Array([6, 6, 6]), 'audio/wav')).rejects.toBeInstanceOf(InvalidStorageKey)
    await expect(storage.get(key)).rejects.toBeInstanceOf(InvalidStorageKey)
    await expect(storage.head(key)).rejects.toBeInstanceOf(InvalidStorageKey)
    await expect(storage.stream(key, { start: 0, end: 1 })).rejects.toBeInstanceOf(InvalidStorageKey)
    await expect(storage.delete(key)).rejects.toBeInstanceOf(InvalidStorageKey)
    await expect(storage.move('inside/ok.wav', key)).rejects.toBeInstanceOf(InvalidStorageKey)
    await expect(storage.move(key, 'inside/new.wav')).rejects.toBeInstanceOf(InvalidStorageKey)
    expect(await everything()).toEqual(before)
    expect(await storage.get('inside/ok.wav')).toEqual(new Uint8Array([1]))
  })

  it('clears nothing that was written whole, and refuses a prefix that leaves the store', async () => {
    const { storage } = await driver.make()
    await storage.put('pending/strikes/w/s.wav', new Uint8Array([1]), 'audio/wav')
    expect(await storage.clearUnfinished('pending/strikes/', 0, new Date(Date.now() + 60_000))).toEqual([])
    expect((await storage.list('pending/strikes/')).map(o => o.key)).toEqual(['pending/strikes/w/s.wav'])
    await expect(storage.clearUnfinished('../', 0, new Date())).rejects.toBeInstanceOf(InvalidStorageKey)
  })

  it('refuses a listing prefix that leaves the store', async () => {
    const { storage } = await driver.make()
    await expect(storage.list('../')).rejects.toBeInstanceOf(InvalidStorageKey)
    await expect(storage.list('/etc/')).rejects.toBeInstanceOf(InvalidStorageKey)
    await expect(storage.list('a/%2e%2e/')).rejects.toBeInstanceOf(InvalidStorageKey)
  })

  it('answers ping when reachable', async () => {
    const { storage } = await driver.make()
    await expect(storage.ping()).resolves.toBeUndefined()
  })
})

describe('storage that cannot be reached', () => {
  it('an S3 endpoint nobody listens on fails ping, and so does a missing bucket', async () => {
    const port = await freePort()
    await expect(s3Storage({ ...fakeBucketConfig('tw-none'), endpoint: `http://127.0.0.1:${port}` }).ping()).rejects.toThrow()
    await expect(s3Storage(fakeBucketConfig('tw-no-such-bucket')).ping()).rejects.toThrow()
  })

  it('a storage folder that is a file fails ping', async () => {
    const file = join(mkdtempSync(join(tmpdir(), 'tw-contract-')), 'not-a-folder')
    writeFileSync(file, 'x')
    await expect(fileStorage(file).ping()).rejects.toThrow()
  })
})
