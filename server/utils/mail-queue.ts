import { randomUUID } from 'node:crypto'
import { hostname } from 'node:os'
import { and, eq } from 'drizzle-orm'
import type PgBoss from 'pg-boss'
import { mailMessages } from '../database/schema'
import type { Database } from '../database/client'
import type { BackgroundJob } from './certificate-pdf-job'
import { sendClaimedJob } from './job-claim'
import { JobQueue, ensureQueue, workEach, type JobQueueOptions } from './job-queue'
import { deliverMessage, needsJob, unscheduledMail, type DeliveryLease, type SmtpConfig } from './mail'
import type { BlobStorage } from './storage'

export const MAIL_QUEUE = 'mail-send'

export interface MailQueueOptions extends JobQueueOptions {
  db: Database
  storage: BlobStorage
  smtp: SmtpConfig
  retryLimit: number
  retryDelayS: number
  /** How long a worker's claim on a message holds; a claim of a worker that died is taken over after it. */
  leaseS: number
  /** Other jobs run on the same pg-boss instance (the certificate PDF job). */
  jobs?: BackgroundJob[]
}

/**
 * The mail worker. The outbox table is the source of truth: a request only adds
 * a row; this process (on any app instance) turns rows into pg-boss jobs and
 * delivers them with retries. If the queue cannot start, rows wait in the outbox
 * and are picked up once it does.
 */
export class MailQueue extends JobQueue {
  private readonly lease: DeliveryLease
  protected readonly queues: string[]
  constructor(private readonly options: MailQueueOptions) {
    super(options, { label: 'mail queue', rows: 'queued messages', waiting: 'e-mails stay queued in the outbox until it does' }, 2000)
    this.lease = { workerId: `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`, leaseS: options.leaseS }
    this.queues = [MAIL_QUEUE, ...(options.jobs ?? []).map(job => job.queue)]
  }

  protected async setUp(boss: PgBoss) {
    const o = this.options
    await ensureQueue(boss, { name: MAIL_QUEUE, retryLimit: o.retryLimit, retryDelay: o.retryDelayS, retryBackoff: true })
    await workEach<{ messageId: string }>(boss, MAIL_QUEUE, async (job) => {
      const final = job.retryCount >= job.retryLimit
      const outcome = await deliverMessage(o.db, o.storage, o.smtp, job.data.messageId, final, this.lease)
      if (outcome instanceof Error) {
        this.log(`Tonewright mail: message ${job.data.messageId} not delivered (attempt ${job.retryCount + 1} of ${job.retryLimit + 1}): ${outcome.message}`)
        throw outcome
      }
    })
    for (const job of o.jobs ?? []) await job.start(boss)
  }

  /**
   * Turns outbox rows that need a job into jobs (see needsJob: also those whose
   * worker died mid-send), after the other jobs' sweeps. The claim (job_id set
   * while the row still needs a job) keeps two instances from doubling a job.
   */
  protected async schedule(boss: PgBoss) {
    const o = this.options
    for (const job of o.jobs ?? []) {
      await job.sweep(boss).catch(error => this.log(`Tonewright background jobs: could not schedule (${(error as Error).message}); will try again.`))
    }
    for (const { id } of await unscheduledMail(o.db)) {
      await sendClaimedJob(
        async () => (await o.db.update(mailMessages).set({ jobId: 'claimed', claimedBy: null, claimedUntil: null })
          .where(and(eq(mailMessages.id, id), needsJob())).returning({ id: mailMessages.id })).length > 0,
        () => boss.send(MAIL_QUEUE, { messageId: id }, { retryLimit: o.retryLimit, retryDelay: o.retryDelayS, retryBackoff: true }),
        jobId => o.db.update(mailMessages).set({ jobId }).where(eq(mailMessages.id, id)),
      )
    }
  }
}

let instance: MailQueue | null = null

export function setMailQueue(queue: MailQueue | null) {
  instance = queue
}

/** Schedules queued messages now instead of at the next sweep (no-op when the queue is not running). */
export function kickMailQueue() {
  void instance?.sweep()
}
