import { randomUUID } from 'node:crypto'
import { hostname } from 'node:os'
import { and, eq } from 'drizzle-orm'
import PgBoss from 'pg-boss'
import { mailMessages } from '../database/schema'
import type { Database } from '../database/client'
import type { BackgroundJob } from './certificate-pdf-job'
import { sendClaimedJob } from './job-claim'
import { deliverMessage, needsJob, unscheduledMail, type DeliveryLease, type SmtpConfig } from './mail'
import type { BlobStorage } from './storage'

export const MAIL_QUEUE = 'mail-send'

export interface MailQueueOptions {
  db: Database
  storage: BlobStorage
  databaseUrl: string
  smtp: SmtpConfig
  retryLimit: number
  retryDelayS: number
  /** How long a worker's claim on a message holds; a claim of a worker that died is taken over after it. */
  leaseS: number
  /** Other jobs run on the same pg-boss instance (the certificate PDF job). */
  jobs?: BackgroundJob[]
  /** How often queued messages without a job are picked up, in ms. */
  sweepMs?: number
  log?: (line: string) => void
}

/**
 * The mail worker. The outbox table is the source of truth: a request only adds
 * a row; this process (on any app instance) turns rows into pg-boss jobs and
 * delivers them with retries. If the queue cannot start, rows wait in the outbox
 * and are picked up once it does.
 */
export class MailQueue {
  private boss: PgBoss | null = null
  private sweepTimer: NodeJS.Timeout | null = null
  private restartTimer: NodeJS.Timeout | null = null
  private sweeping = false
  private stopped = false
  private readonly lease: DeliveryLease
  constructor(private readonly options: MailQueueOptions) {
    this.lease = { workerId: `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`, leaseS: options.leaseS }
  }

  get running() {
    return this.boss !== null
  }

  private log(line: string) {
    (this.options.log ?? console.log)(line)
  }

  async start(): Promise<boolean> {
    const o = this.options
    const boss = new PgBoss({ connectionString: o.databaseUrl, max: 4, application_name: 'tonewright-mail' })
    boss.on('error', error => this.log(`Tonewright mail queue: ${error.message}`))
    try {
      await boss.start()
      if (!(await boss.getQueue(MAIL_QUEUE))) {
        try {
          await boss.createQueue(MAIL_QUEUE, { name: MAIL_QUEUE, retryLimit: o.retryLimit, retryDelay: o.retryDelayS, retryBackoff: true })
        }
        catch (error) {
          // Another instance may have created it a moment ago.
          if (!(await boss.getQueue(MAIL_QUEUE))) throw error
        }
      }
      await boss.work<{ messageId: string }>(MAIL_QUEUE, { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
        if (!job) return
        const final = job.retryCount >= job.retryLimit
        const outcome = await deliverMessage(o.db, o.storage, o.smtp, job.data.messageId, final, this.lease)
        if (outcome instanceof Error) {
          this.log(`Tonewright mail: message ${job.data.messageId} not delivered (attempt ${job.retryCount + 1} of ${job.retryLimit + 1}): ${outcome.message}`)
          throw outcome
        }
      })
      for (const job of o.jobs ?? []) await job.start(boss)
    }
    catch (error) {
      this.log(`Tonewright: the mail queue could not start (${(error as Error).message}). The app keeps serving; e-mails stay queued in the outbox and go out once the queue starts (next try in 30 s).`)
      await boss.stop({ graceful: false, wait: false }).catch(() => {})
      if (!this.stopped) this.restartTimer = setTimeout(() => void this.start(), 30_000)
      return false
    }
    this.boss = boss
    this.log('Tonewright: mail queue started.')
    this.sweepTimer = setInterval(() => void this.sweep(), o.sweepMs ?? 2000)
    void this.sweep()
    return true
  }

  /**
   * Turns outbox rows that need a job into jobs (see needsJob: also those whose
   * worker died mid-send), then runs the other jobs' sweeps. The claim (job_id set
   * while the row still needs a job) keeps two instances from doubling a job.
   */
  async sweep() {
    if (!this.boss || this.sweeping) return
    this.sweeping = true
    try {
      const o = this.options
      for (const job of o.jobs ?? []) {
        await job.sweep(this.boss).catch(error => this.log(`Tonewright background jobs: could not schedule (${(error as Error).message}); will try again.`))
      }
      for (const { id } of await unscheduledMail(o.db)) {
        await sendClaimedJob(
          async () => (await o.db.update(mailMessages).set({ jobId: 'claimed', claimedBy: null, claimedUntil: null })
            .where(and(eq(mailMessages.id, id), needsJob())).returning({ id: mailMessages.id })).length > 0,
          () => this.boss!.send(MAIL_QUEUE, { messageId: id }, { retryLimit: o.retryLimit, retryDelay: o.retryDelayS, retryBackoff: true }),
          jobId => o.db.update(mailMessages).set({ jobId }).where(eq(mailMessages.id, id)),
        )
      }
    }
    catch (error) {
      this.log(`Tonewright mail queue: could not schedule queued messages (${(error as Error).message}); will try again.`)
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

let instance: MailQueue | null = null

export function setMailQueue(queue: MailQueue | null) {
  instance = queue
}

/** Schedules queued messages now instead of at the next sweep (no-op when the queue is not running). */
export function kickMailQueue() {
  void instance?.sweep()
}
