import { setTimeout as sleep } from 'node:timers/promises'

/** A refusal that only says "not now": the analysis pool's full queue (503 with `data.retryAfterS`). */
export function isBusyRefusal(error: unknown): error is { statusCode: 503, data?: { retryAfterS?: number } } {
  return (error as { statusCode?: number } | null)?.statusCode === 503
}

/**
 * Runs a measurement for background work, which can wait its turn: while the pool answers
 * "busy" (its queue is full of strikes benchmakers are waiting for), it waits the time the
 * pool asks (at least `minWaitMs`) and tries again, up to `giveUpAfterMs`; any other
 * failure, and the last refusal, is thrown as it came.
 */
export async function measureWhenFree<T>(
  measure: () => Promise<T>,
  options: { giveUpAfterMs?: number, minWaitMs?: number, wait?: (ms: number) => Promise<unknown>, now?: () => number } = {},
): Promise<T> {
  const giveUpAfterMs = options.giveUpAfterMs ?? 10 * 60_000
  const minWaitMs = options.minWaitMs ?? 500
  const wait = options.wait ?? sleep
  const now = options.now ?? Date.now
  const started = now()
  for (;;) {
    try {
      return await measure()
    }
    catch (error) {
      if (!isBusyRefusal(error)) throw error
      const waitMs = Math.max(minWaitMs, (error.data?.retryAfterS ?? 1) * 1000)
      if (now() - started + waitMs > giveUpAfterMs) throw error
      await wait(waitMs)
    }
  }
}
