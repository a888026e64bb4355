import { existsSync, mkdtempSync, readdirSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import postgres from 'postgres'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { memberWithRole, newWorkshop } from '../support/http'
import { createSet, postStrike, strikeWav } from '../support/records'
import { startServer } from '../support/server'

const STORAGE = process.env.NUXT_STORAGE_DIR ?? '.data/test-storage'
const sql = postgres(process.env.NUXT_DATABASE_URL!, { max: 2, onnotice: () => {} })
afterAll(() => sql.end())

/** Files under a storage folder (recursive), as relative paths; a write still under way counts too. */
function filesUnder(root: string, folder: string): string[] {
  const dir = join(root, folder)
  return existsSync(dir) ? readdirSync(dir, { recursive: true, withFileTypes: true }).filter(e => e.isFile()).map(e => e.name) : []
}

/** Files written whole under a storage folder (a write under way is named `*.partial` until renamed). */
const wholeFilesUnder = (root: string, folder: string) => filesUnder(root, folder).filter(name => !name.endsWith('.partial'))

async function until(check: () => boolean | Promise<boolean>, what: string, limitMs = 30_000) {
  const stop = Date.now() + limitMs
  while (!(await check())) {
    if (Date.now() > stop) throw new Error(`timed out waiting until ${what}`)
    await new Promise(resolve => setTimeout(resolve, 25))
  }
}

/**
 * Holds the piece's row lock in a transaction of our own: recordStrike measures, writes the
 * pending audio, then waits for this lock, so the test can act at exactly that moment.
 */
async function holdingPiece(pieceId: string, during: (tx: postgres.TransactionSql) => Promise<void>) {
  await sql.begin(async (tx) => {
    await tx`select id from pieces where id = ${pieceId} for update`
    await during(tx)
  })
}

async function workshopWithPiece(name: string) {
  const owner = await newWorkshop(name)
  const set = await createSet(owner.token)
  const piece = set.pieces[0] as { id: string, targetHz: number }
  return { owner, piece, wav: strikeWav(piece.targetHz, [1, 4], [0, 0]) }
}

describe('class: nothing is half-saved or left dangling (strike audio)', () => {
  it('fault: the transaction aborts after the file is written (the piece was approved meanwhile): 409, no row, no file', async () => {
    const { owner, piece, wav } = await workshopWithPiece('Abort workshop')
    const pending = `pending/strikes/${owner.workshopId}`
    let reply: Awaited<ReturnType<typeof postStrike>> | undefined
    await holdingPiece(piece.id, async (tx) => {
      const request = postStrike(owner.token, piece.id, wav).then((r) => {
        reply = r
      })
      await until(() => filesUnder(STORAGE, pending).length === 1, 'the pending audio is written')
      await tx`update pieces set stage = 'approved' where id = ${piece.id}`
      void request
    })
    await until(() => reply !== undefined, 'the strike answers')
    expect(reply!.status).toBe(409)
    expect(reply!.body.message).toMatch(/changed stage while the strike was measured/)
    expect(await sql`select id from strikes where piece_id = ${piece.id}`).toHaveLength(0)
    expect(filesUnder(STORAGE, pending)).toEqual([])
    expect(filesUnder(STORAGE, `workshops/${owner.workshopId}`)).toEqual([])
  }, 60_000)

  it('a strike that commits is stored under its final key and nothing stays pending', async () => {
    const { owner, piece, wav } = await workshopWithPiece('Commit workshop')
    const reply = await postStrike(owner.token, piece.id, wav)
    expect(reply.status).toBe(201)
    const [row] = await sql`select audio_key from strikes where id = ${reply.body.id}`
    expect(existsSync(join(STORAGE, row!.audio_key))).toBe(true)
    expect(filesUnder(STORAGE, `pending/strikes/${owner.workshopId}`)).toEqual([])
  })

  it('fault: the app is killed mid-upload (audio written, row not committed); after a restart the sweep leaves nothing dangling', async () => {
    const storage = mkdtempSync(join(tmpdir(), 'tw-sweep-'))
    const env = { NUXT_STORAGE_DIR: storage, NUXT_STRIKE_UPLOAD_SWEEP_OLDER_THAN_S: '0' }
    const first = await startServer(env)
    const { owner, piece, wav } = await workshopWithPiece('Crash workshop')
    const pending = `pending/strikes/${owner.workshopId}`
    try {
      await holdingPiece(piece.id, async () => {
        const form = new FormData()
        form.set('file', new Blob([wav], { type: 'audio/wav' }), 'strike.wav')
        const request = fetch(`${first.baseUrl}/api/pieces/${piece.id}/strikes`, { method: 'POST', headers: { authorization: `Bearer ${owner.token}` }, body: form }).catch(() => null)
        // Whole, not mid-write: the sweep's other case (a write left unfinished) has its own test.
        await until(() => wholeFilesUnder(storage, pending).length === 1, 'the pending audio is written', 90_000)
        await first.stop('SIGKILL')
        expect(await request).toBeNull()
      })
      // Dangling now: a file without a row.
      expect(filesUnder(storage, pending)).toHaveLength(1)
      expect(await sql`select id from strikes where piece_id = ${piece.id}`).toHaveLength(0)
      const second = await startServer(env)
      try {
        await until(() => filesUnder(storage, pending).length === 0, 'the sweep at start removes the pending audio')
        expect(filesUnder(storage, `workshops/${owner.workshopId}`)).toEqual([])
        // The restarted server records strikes normally.
        const form = new FormData()
        form.set('file', new Blob([wav], { type: 'audio/wav' }), 'strike.wav')
        const again = await fetch(`${second.baseUrl}/api/pieces/${piece.id}/strikes`, { method: 'POST', headers: { authorization: `Bearer ${owner.token}` }, body: form })
        expect(again.status).toBe(201)
        expect(filesUnder(storage, `workshops/${owner.workshopId}`)).toHaveLength(1)
      }
      finally {
        await second.stop()
      }
    }
    finally {
      await first.stop('SIGKILL')
    }
  }, 120_000)
})

describe('class: races — recording a strike never overwrites a change made while the analysis ran', () => {
  let owner: Awaited<ReturnType<typeof newWorkshop>>
  let bench: Awaited<ReturnType<typeof memberWithRole>>
  beforeAll(async () => {
    owner = await newWorkshop('Race workshop')
    bench = await memberWithRole(owner.token, 'benchmaker')
  })

  /** Strike `piece` as `token` and, while the strike is being measured, give the piece to `assigneeId`. */
  async function strikeWhileReassigned(token: string, piece: { id: string, targetHz: number }, assigneeId: string) {
    let reply: Awaited<ReturnType<typeof postStrike>> | undefined
    await holdingPiece(piece.id, async (tx) => {
      const request = postStrike(token, piece.id, strikeWav(piece.targetHz, [1, 4], [0, 0])).then((r) => {
        reply = r
      })
      await until(() => filesUnder(STORAGE, `pending/strikes/${owner.workshopId}`).length === 1, 'the strike is measured')
      // The assignment commits while the strike waits with its first read of the piece in hand.
      await tx`update pieces set assignee_id = ${assigneeId} where id = ${piece.id}`
      void request
    })
    await until(() => reply !== undefined, 'the strike answers')
    return reply!
  }

  it('the owner strikes an unassigned piece while a supervisor assigns it: the assignment stays', async () => {
    const set = await createSet(owner.token)
    const piece = set.pieces[0] as { id: string, targetHz: number }
    const reply = await strikeWhileReassigned(owner.token, piece, bench.userId)
    expect(reply.status).toBe(201)
    const [row] = await sql`select assignee_id, strike_count, latest_strike_id from pieces where id = ${piece.id}`
    expect(row).toEqual({ assignee_id: bench.userId, strike_count: 1, latest_strike_id: reply.body.id })
  }, 60_000)

  it('a benchmaker\'s strike on a piece given to someone else meanwhile is refused (403) and leaves nothing', async () => {
    const set = await createSet(owner.token)
    const piece = set.pieces[1] as { id: string, targetHz: number }
    const other = await memberWithRole(owner.token, 'benchmaker')
    const reply = await strikeWhileReassigned(bench.token, piece, other.userId)
    expect(reply.status).toBe(403)
    const [row] = await sql`select assignee_id, strike_count from pieces where id = ${piece.id}`
    expect(row).toEqual({ assignee_id: other.userId, strike_count: 0 })
    expect(filesUnder(STORAGE, `pending/strikes/${owner.workshopId}`)).toEqual([])
  }, 60_000)
})
