import PgBoss from 'pg-boss'

type Log = (line: string) => void

/**
 * One pg-boss per process and database, shared by every queue worker. Its start creates
 * pg-boss's schema and each worker's set-up creates queues (tables attached to one parent):
 * two of either at once on a fresh database deadlock in PostgreSQL, so the start happens
 * once and the set-ups take turns.
 */
interface SharedBoss {
  boss: PgBoss
  started: Promise<unknown>
  turn: Promise<unknown>
  users: number
}

const shared = new Map<string, SharedBoss>()

async function acquireBoss(databaseUrl: string, log: Log): Promise<SharedBoss> {
  let entry = shared.get(databaseUrl)
  if (!entry) {
    const boss = new PgBoss({ connectionString: databaseUrl, max: 6, application_name: 'tonewright-jobs' })
    boss.on('error', error => log(`Tonewright job queue: ${error.message}`))
    entry = { boss, started: boss.start(), turn: Promise.resolve(), users: 0 }
    shared.set(databaseUrl, entry)
  }
  entry.users++
  try {
    await entry.started
  }
  catch (error) {
    // A boss that could not start is not handed out again: the next try makes a new one.
    if (shared.get(databaseUrl) === entry) shared.delete(databaseUrl)
    await releaseBoss(databaseUrl, entry, [], false)
    throw error
  }
  return entry
}

/** Stops the shared boss when its last user leaves; otherwise only this user's workers. */
async function releaseBoss(databaseUrl: string, entry: SharedBoss, queues: string[], graceful: boolean) {
  entry.users--
  if (entry.users > 0) {
    for (const queue of queues) await entry.boss.offWork(queue).catch(() => {})
    return
  }
  if (shared.get(databaseUrl) === entry) shared.delete(databaseUrl)
  await entry.boss.stop(graceful ? { graceful: true, timeout: 5000 } : { graceful: false, wait: false }).catch(() => {})
}

/** Runs `task` after every set-up that asked before it has ended. */
function inTurn<T>(entry: SharedBoss, task: () => Promise<T>): Promise<T> {
  const result = entry.turn.then(task)
  entry.turn = result.catch(() => {})
  return result
}

/** Creates a queue unless it exists; another app instance may create it at the same moment. */
export async function ensureQueue(boss: PgBoss, options: PgBoss.Queue) {
  if (await boss.getQueue(options.name)) return
  try {
    await boss.createQueue(options.name, options)
  }
  catch (error) {
    if (!(await boss.getQueue(options.name))) throw error
  }
}

/** Works a queue's jobs one at a time, with their retry counts. */
export function workEach<T extends object>(boss: PgBoss, queue: string, handler: (job: PgBoss.JobWithMetadata<T>) => Promise<void>) {
  return boss.work<T>(queue, { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
    if (job) await handler(job)
  })
}

export interface JobQueueOptions {
  databaseUrl: string
  /** How often rows that need a job are picked up, in ms. */
  sweepMs?: number
  log?: (line: string) => void
}

/** What a worker's log lines call it, its rows and what waits while it is down. */
export interface JobQueueWords {
  label: string
  rows: string
  waiting: string
}

/**
 * A queue worker whose table is the source of truth: a request only adds a row; on any
 * app instance the worker turns such rows into pg-boss jobs (`schedule`, every sweep)
 * and works them (`setUp` creates the queues and registers the handlers). A worker that
 * cannot start never stops the app: it logs a clear line and tries again in 30 s.
 */
export abstract class JobQueue {
  protected boss: PgBoss | null = null
  private entry: SharedBoss | null = null
  private sweepTimer: NodeJS.Timeout | null = null
  private restartTimer: NodeJS.Timeout | null = null
  private sweeping = false
  private sweepAgain = false
  private stopped = false

  constructor(private readonly base: JobQueueOptions, private readonly words: JobQueueWords, private readonly defaultSweepMs: number) {}

  /** The pg-boss queues this worker works. */
  protected abstract readonly queues: string[]
  protected abstract setUp(boss: PgBoss): Promise<void>
  protected abstract schedule(boss: PgBoss): Promise<void>

  get running() {
    return this.boss !== null
  }

  protected log(line: string) {
    (this.base.log ?? console.log)(line)
  }

  async start(): Promise<boolean> {
    let entry: SharedBoss | null = null
    try {
      entry = await acquireBoss(this.base.databaseUrl, line => this.log(line))
      const boss = entry.boss
      await inTurn(entry, () => this.setUp(boss))
    }
    catch (error) {
      this.log(`Tonewright: the ${this.words.label} could not start (${(error as Error).message}); the app keeps serving and ${this.words.waiting} (next try in 30 s).`)
      if (entry) await releaseBoss(this.base.databaseUrl, entry, this.queues, false)
      if (!this.stopped) this.restartTimer = setTimeout(() => void this.start(), 30_000)
      return false
    }
    if (this.stopped) {
      await releaseBoss(this.base.databaseUrl, entry, this.queues, true)
      return false
    }
    this.entry = entry
    this.boss = entry.boss
    this.log(`Tonewright: ${this.words.label} started.`)
    this.sweepTimer = setInterval(() => void this.sweep(), this.base.sweepMs ?? this.defaultSweepMs)
    void this.sweep()
    return true
  }

  /**
   * Turns rows that need a job into jobs; a failure waits for the next sweep. A kick that
   * arrives while a sweep runs sweeps once more right after it (that sweep may have read
   * the rows before the new one was written), rather than waiting for the next interval.
   */
  async sweep() {
    if (!this.boss) return
    if (this.sweeping) {
      this.sweepAgain = true
      return
    }
    this.sweeping = true
    try {
      do {
        this.sweepAgain = false
        if (!this.boss) break
        try {
          await this.schedule(this.boss)
        }
        catch (error) {
          this.log(`Tonewright ${this.words.label}: could not schedule ${this.words.rows} (${(error as Error).message}); will try again.`)
        }
      } while (this.sweepAgain)
    }
    finally {
      this.sweeping = false
    }
  }

  async stop() {
    this.stopped = true
    if (this.sweepTimer) clearInterval(this.sweepTimer)
    if (this.restartTimer) clearTimeout(this.restartTimer)
    const entry = this.entry
    this.entry = null
    this.boss = null
    if (entry) await releaseBoss(this.base.databaseUrl, entry, this.queues, true)
  }
}
