import { setResponseHeader } from 'h3'
import { createAnalysisPool, setAnalysisPool } from '../utils/analysis-pool'

/**
 * Starts the analysis worker pool with the server (threads and queue from runtime
 * config `analysis`), sets `Retry-After` on the 503 of a full queue, and stops the
 * threads when the server closes.
 */
export default defineNitroPlugin((nitroApp) => {
  const config = useRuntimeConfig().analysis as { threads: number | string, maxQueue: number | string, retryAfterS: number | string, workerFile: string }
  const pool = createAnalysisPool({
    threads: Number(config.threads), maxQueue: Number(config.maxQueue), retryAfterS: Number(config.retryAfterS),
    workerFile: config.workerFile || undefined,
  })
  setAnalysisPool(pool)
  console.info(`Tonewright: analysis ${pool.mode === 'pool' ? `in ${pool.threads} worker threads` : 'on the request thread'}, at most ${pool.maxQueue} waiting.`)
  nitroApp.hooks.hook('error', (error, { event }) => {
    const data = (error as { data?: { retryAfterS?: unknown } }).data
    if (event && typeof data?.retryAfterS === 'number') setResponseHeader(event, 'retry-after', data.retryAfterS)
  })
  nitroApp.hooks.hook('close', async () => {
    setAnalysisPool(undefined)
    await pool.close()
  })
})
