import type PgBoss from 'pg-boss'
import { describe, expect, it } from 'vitest'
import { JobQueue } from '../../../../server/utils/job-queue'

/** A queue whose sweeps are counted and held open until released (no pg-boss needed to sweep). */
class CountingQueue extends JobQueue {
  protected readonly queues = []
  sweeps = 0
  release: (() => void) | null = null
  constructor() {
    super({ databaseUrl: 'postgres://unused' }, { label: 'test queue', rows: 'rows', waiting: 'rows wait' }, 60_000)
    this.boss = {} as PgBoss
  }

  protected async setUp() {}
  protected async schedule() {
    this.sweeps++
    await new Promise<void>(resolve => (this.release = resolve))
  }
}

describe('JobQueue.sweep', () => {
  it('sweeps once more after the running sweep when kicked meanwhile (a row written during it is not left for the next interval)', async () => {
    const queue = new CountingQueue()
    const first = queue.sweep()
    expect(queue.sweeps).toBe(1)
    void queue.sweep()
    void queue.sweep()
    queue.release!()
    await new Promise(resolve => setImmediate(resolve))
    expect(queue.sweeps).toBe(2)
    queue.release!()
    await first
    expect(queue.sweeps).toBe(2)
  })

  it('sweeps once when nobody kicks meanwhile', async () => {
    const queue = new CountingQueue()
    const first = queue.sweep()
    queue.release!()
    await first
    expect(queue.sweeps).toBe(1)
  })
})
