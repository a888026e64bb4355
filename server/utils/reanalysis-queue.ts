import { and, eq, isNull, lt } from 'drizzle-orm'
import type PgBoss from 'pg-boss'
import { reanalysisRuns } from '../database/schema'
import type { Database } from '../database/client'
import { sendClaimedJob } from './job-claim'
import { JobQueue, ensureQueue, workEach, type JobQueueOptions } from './job-queue'
import { executeReanalysis, failReanalysis } from './reanalysis-run'
import type { BlobStorage } from './storage'

export const REANALYSIS_QUEUE = 'strike-reanalyze'

/** A run still "running" this long after it started has lost its worker (a whole set takes minutes, not hours). */
const STALE_MS = 60 * 60 * 1000

export interface ReanalysisQueueOptions extends JobQueueOptions {
  db: Database
  storage: BlobStorage
}

const STOPPED = 'The re-measurement stopped before it finished; the pieces it finished are saved. Start it again to measure the rest.'

/**
 * The re-measurement worker. The run table is the source of truth: a request only
 * adds a queued row; this process (on any app instance) turns queued rows into
 * pg-boss jobs and works them, one at a time, with one retry.
 */
export class ReanalysisQueue extends JobQueue {
  protected readonly queues = [REANALYSIS_QUEUE]
  private workerId: string | null = null
  constructor(private readonly options: ReanalysisQueueOptions) {
    super(options, { label: 're-measurement queue', rows: 'queued runs', waiting: 'queued re-measurements wait until it does' }, 5000)
  }

  protected async setUp(boss: PgBoss) {
    const o = this.options
    await ensureQueue(boss, { name: REANALYSIS_QUEUE, retryLimit: 1, retryDelay: 10 })
    this.workerId = await workEach<{ runId: string }>(boss, REANALYSIS_QUEUE, async (job) => {
      try {
        await executeReanalysis(o.db, o.storage, job.data.runId)
      }
      catch (error) {
        this.log(`Tonewright re-measurement ${job.data.runId} stopped (attempt ${job.retryCount + 1}): ${(error as Error).message}`)
        if (job.retryCount >= job.retryLimit) await failReanalysis(o.db, job.data.runId, STOPPED)
        throw error
      }
    })
  }

  /** Turns queued runs without a job into jobs (the claim keeps two instances from doubling one) and fails stale ones. */
  protected async schedule(boss: PgBoss) {
    const o = this.options
    const stale = await o.db.select({ id: reanalysisRuns.id }).from(reanalysisRuns)
      .where(and(eq(reanalysisRuns.status, 'running'), lt(reanalysisRuns.startedAt, new Date(Date.now() - STALE_MS))))
    for (const { id } of stale) await failReanalysis(o.db, id, STOPPED)
    const queued = await o.db.select({ id: reanalysisRuns.id }).from(reanalysisRuns)
      .where(and(eq(reanalysisRuns.status, 'queued'), isNull(reanalysisRuns.jobId))).limit(50)
    for (const { id } of queued) {
      await sendClaimedJob(
        async () => (await o.db.update(reanalysisRuns).set({ jobId: 'claimed' })
          .where(and(eq(reanalysisRuns.id, id), eq(reanalysisRuns.status, 'queued'), isNull(reanalysisRuns.jobId))).returning({ id: reanalysisRuns.id })).length > 0,
        () => boss.send(REANALYSIS_QUEUE, { runId: id }, { retryLimit: 1, retryDelay: 10, expireInSeconds: 30 * 60 }),
        jobId => o.db.update(reanalysisRuns).set({ jobId }).where(eq(reanalysisRuns.id, id)),
      )
    }
    // Someone is watching the run's progress: an idle worker of this instance fetches now, not at its next poll.
    if (queued.length && this.workerId) boss.notifyWorker(this.workerId)
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
