import { randomUUID } from 'node:crypto'
import { mkdirSync, mkdtempSync, utimesSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { dirname, join } from 'node:path'
import postgres from 'postgres'
import { afterAll, describe, expect, it } from 'vitest'
import { createDatabase } from '../../../../server/database/client'
import { fileStorage } from '../../../../server/utils/storage-fs'
import { SWEEP_LOCK_KEY, sweepStrikeUploads } from '../../../../server/utils/strike-uploads'
import { newWorkshop } from '../../support/http'
import { createSet, postStrike, strikeWav } from '../../support/records'

const { db, client } = createDatabase(process.env.NUXT_DATABASE_URL!, { max: 2 })
const other = postgres(process.env.NUXT_DATABASE_URL!, { max: 1, onnotice: () => {} })
afterAll(async () => {
  await client.end()
  await other.end()
})

const MINUTE = 60_000

describe('sweepStrikeUploads (pending strike audio against the real database)', () => {
  it('promotes a committed strike\'s pending audio, removes an orphan, keeps a fresh upload', async () => {
    const owner = await newWorkshop('Sweep workshop')
    const set = await createSet(owner.token)
    const strike = await postStrike(owner.token, set.pieces[0].id, strikeWav(set.pieces[0].targetHz, [1, 4], [0, 0]))
    expect(strike.status).toBe(201)
    const [row] = await other`select audio_key from strikes where id = ${strike.body.id}`
    const storage = fileStorage(mkdtempSync(join(tmpdir(), 'tw-sweep-unit-')))
    const committed = `pending/strikes/${owner.workshopId}/${strike.body.id}.wav`
    const orphan = `pending/strikes/${owner.workshopId}/${randomUUID()}.wav`
    await storage.put(committed, new Uint8Array([1, 2, 3]), 'audio/wav')
    await storage.put(orphan, new Uint8Array([4]), 'audio/wav')

    // Nothing is old enough yet: the sweep keeps both.
    const early = await sweepStrikeUploads(db, storage, 10 * MINUTE)
    expect(early).toEqual({ ran: true, removed: [], promoted: [] })

    // Eleven minutes later: the committed one goes to its row's key (its process died before promoting), the orphan goes.
    const later = await sweepStrikeUploads(db, storage, 10 * MINUTE, new Date(Date.now() + 11 * MINUTE))
    expect(later).toEqual({ ran: true, removed: [orphan], promoted: [committed] })
    expect(await storage.get(row!.audio_key)).toEqual(new Uint8Array([1, 2, 3]))
    expect(await storage.list('pending/strikes/')).toEqual([])
  })

  it('does nothing while another instance holds the sweep lock', async () => {
    const storage = fileStorage(mkdtempSync(join(tmpdir(), 'tw-sweep-lock-')))
    const orphan = `pending/strikes/${randomUUID()}/${randomUUID()}.wav`
    await storage.put(orphan, new Uint8Array([1]), 'audio/wav')
    await other.begin(async (tx) => {
      await tx`select pg_advisory_xact_lock(${SWEEP_LOCK_KEY})`
      expect(await sweepStrikeUploads(db, storage, 0)).toEqual({ ran: false, removed: [], promoted: [] })
    })
    expect((await storage.list('pending/strikes/')).map(o => o.key)).toEqual([orphan])
    expect((await sweepStrikeUploads(db, storage, 0)).removed).toEqual([orphan])
    expect(await storage.get(orphan)).toBeNull()
  })

  it('removes a write that a killed process left unfinished once it is old enough, and keeps one still under way', async () => {
    const root = mkdtempSync(join(tmpdir(), 'tw-sweep-partial-'))
    const storage = fileStorage(root)
    const abandoned = `pending/strikes/${randomUUID()}/${randomUUID()}.wav.4242.partial`
    const underWay = `pending/strikes/${randomUUID()}/${randomUUID()}.wav.4343.partial`
    for (const key of [abandoned, underWay]) {
      mkdirSync(dirname(join(root, key)), { recursive: true })
      writeFileSync(join(root, key), new Uint8Array([1, 2]))
    }
    const elevenMinutesAgo = new Date(Date.now() - 11 * MINUTE)
    utimesSync(join(root, abandoned), elevenMinutesAgo, elevenMinutesAgo)
    // Neither is an object: the listing never shows them.
    expect(await storage.list('pending/strikes/')).toEqual([])
    expect(await sweepStrikeUploads(db, storage, 10 * MINUTE)).toEqual({ ran: true, removed: [abandoned], promoted: [] })
    expect((await storage.clearUnfinished('pending/strikes/', 0, new Date(Date.now() + 1000)))).toEqual([underWay])
  })
})
