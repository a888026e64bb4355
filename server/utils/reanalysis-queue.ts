import { and, eq, isNull, lt } from 'drizzle-orm'
import PgBoss from 'pg-boss'
import { reanalysisRuns } from '../database/schema'
import type { Database } from '../database/client'
import { sendClaimedJob } from './job-claim'
import { executeReanalysis, failReanalysis } from './reanalysis-run'
import type { BlobStorage } from './storage'

export const REANALYSIS_QUEUE = 'strike-reanalyze'

/** A run still "running" this long after it started has lost its worker (a whole set takes minutes, not hours). */
const STALE_MS = 60 * 60 * 1000

export interface ReanalysisQueueOptions {
  db: Database
  storage: BlobStorage
  databaseUrl: string
  sweepMs?: number
  log?: (line: string) => void
}

/**
 * The re-measurement worker. The run table is the source of truth: a request only
 * adds a queued row; this process (on any app instance) turns queued rows into
 * pg-boss jobs and works them, one at a time, with one retry.
 */
export class ReanalysisQueue {
  private boss: PgBoss | null = null
  private sweepTimer: NodeJS.Timeout | null = null
  private restartTimer: NodeJS.Timeout | null = null
  private sweeping = false
  private stopped = false
  constructor(private readonly options: ReanalysisQueueOptions) {}

  private log(line: string) {
    (this.options.log ?? console.log)(line)
  }

  async start(): Promise<boolean> {
    const o = this.options
    const boss = new PgBoss({ connectionString: o.databaseUrl, max: 2, application_name: 'tonewright-reanalysis' })
    boss.on('error', error => this.log(`Tonewright re-measurement queue: ${error.message}`))
    try {
      await boss.start()
      if (!(await boss.getQueue(REANALYSIS_QUEUE))) {
        try {
          await boss.createQueue(REANALYSIS_QUEUE, { name: REANALYSIS_QUEUE, retryLimit: 1, retryDelay: 10 })
        }
        catch (error) {
          if (!(await boss.getQueue(REANALYSIS_QUEUE))) throw error
        }
      }
      await boss.work<{ runId: string }>(REANALYSIS_QUEUE, { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
        if (!job) return
        try {
          await executeReanalysis(o.db, o.storage, job.data.runId)
        }
        catch (error) {
          this.log(`Tonewright re-measurement ${job.data.runId} stopped (attempt ${job.retryCount + 1}): ${(error as Error).message}`)
          if (job.retryCount >= job.retryLimit) await failReanalysis(o.db, job.data.runId, 'The re-measurement stopped before it finished; the pieces it finished are saved. Start it again to measure the rest.')
          throw error
        }
      })
    }
    catch (error) {
      this.log(`Tonewright: the re-measurement queue could not start (${(error as Error).message}); queued re-measurements wait (next try in 30 s).`)
      await boss.stop({ graceful: false, wait: false }).catch(() => {})
      if (!this.stopped) this.restartTimer = setTimeout(() => void this.start(), 30_000)
      return false
    }
    this.boss = boss
    this.sweepTimer = setInterval(() => void this.sweep(), o.sweepMs ?? 5000)
    void this.sweep()
    return true
  }

  /** Turns queued runs without a job into jobs (the claim keeps two instances from doubling one) and fails stale ones. */
  async sweep() {
    if (!this.boss || this.sweeping) return
    this.sweeping = true
    const o = this.options
    try {
      const stale = await o.db.select({ id: reanalysisRuns.id }).from(reanalysisRuns)
        .where(and(eq(reanalysisRuns.status, 'running'), lt(reanalysisRuns.startedAt, new Date(Date.now() - STALE_MS))))
      for (const { id } of stale) await failReanalysis(o.db, id, 'The re-measurement stopped before it finished; the pieces it finished are saved. Start it again to measure the rest.')
      const queued = await o.db.select({ id: reanalysisRuns.id }).from(reanalysisRuns)
        .where(and(eq(reanalysisRuns.status, 'queued'), isNull(reanalysisRuns.jobId))).limit(50)
      for (const { id } of queued) {
        await sendClaimedJob(
          async () => (await o.db.update(reanalysisRuns).set({ jobId: 'claimed' })
            .where(and(eq(reanalysisRuns.id, id), eq(reanalysisRuns.status, 'queued'), isNull(reanalysisRuns.jobId))).returning({ id: reanalysisRuns.id })).length > 0,
          () => this.boss!.send(REANALYSIS_QUEUE, { runId: id }, { retryLimit: 1, retryDelay: 10, expireInSeconds: 30 * 60 }),
          jobId => o.db.update(reanalysisRuns).set({ jobId }).where(eq(reanalysisRuns.id, id)),
        )
      }
    }
    catch (error) {
      this.log(`Tonewright re-measurement queue: could not schedule queued runs (${(error as Error).message}); will try again.`)
    }
    finally {
      this.sweeping = false
    }
  }

  async stop() {
    this.stopped = true
    if (this.sweepTimer) clearInterval(this.sweepTimer)
    if (this.restartTimer) clearTimeout(this.restartTimer)
    if (this.boss) await this.boss.stop({ graceful: true, timeout: 5000 }).catch(() => {})
    this.boss = null
  }
}

let instance: ReanalysisQueue | null = null

export function setReanalysisQueue(queue: ReanalysisQueue | null) {
  instance = queue
}

/** Schedules queued runs now instead of at the next sweep (no-op when the queue is not running). */
export function kickReanalysisQueue() {
  void instance?.sweep()
}
