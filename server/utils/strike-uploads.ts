import { inArray, sql } from 'drizzle-orm'
import type { Database } from '../database/client'
import { strikes } from '../database/schema'
import type { BlobStorage } from './storage'
import { PENDING_STRIKE_AUDIO } from './strikes'

/** Advisory lock key of the sweep, so that several app instances never sweep at once. */
export const SWEEP_LOCK_KEY = 7_310_042

export interface SweepReport { ran: boolean, removed: string[], promoted: string[] }

const PENDING = /^pending\/strikes\/[0-9a-f-]{36}\/([0-9a-f-]{36})\.[a-z0-9]+$/

/**
 * Clears pending strike uploads older than `olderThanMs`: one whose strike row committed
 * is promoted to the row's key (its process died between commit and promotion), any
 * other is removed (its transaction never committed), and so is a write left unfinished.
 * Runs under a transaction-scoped advisory lock; when another instance holds it this one
 * does nothing.
 */
export async function sweepStrikeUploads(db: Database, storage: BlobStorage, olderThanMs: number, now = new Date()): Promise<SweepReport> {
  return db.transaction(async (tx) => {
    const [lock] = await tx.execute<{ locked: boolean }>(sql`select pg_try_advisory_xact_lock(${SWEEP_LOCK_KEY}) as locked`)
    if (!lock?.locked) return { ran: false, removed: [], promoted: [] }
    const stale = (await storage.list(PENDING_STRIKE_AUDIO)).filter(o => now.getTime() - o.modifiedAt.getTime() >= olderThanMs)
    const ids = stale.map(o => PENDING.exec(o.key)?.[1]).filter((id): id is string => id !== undefined)
    const rows = ids.length > 0 ? await tx.select({ id: strikes.id, audioKey: strikes.audioKey }).from(strikes).where(inArray(strikes.id, ids)) : []
    const committed = new Map(rows.map(r => [r.id, r.audioKey]))
    // A write the killed process never finished: no row can point at it.
    const report: SweepReport = { ran: true, removed: await storage.clearUnfinished(PENDING_STRIKE_AUDIO, olderThanMs, now), promoted: [] }
    for (const object of stale) {
      const audioKey = committed.get(PENDING.exec(object.key)?.[1] ?? '')
      if (audioKey && await storage.head(audioKey) === null) {
        await storage.move(object.key, audioKey)
        report.promoted.push(object.key)
      }
      else {
        await storage.delete(object.key)
        report.removed.push(object.key)
      }
    }
    return report
  })
}
