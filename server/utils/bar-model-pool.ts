import { pathToFileURL } from 'node:url'
import Piscina from 'piscina'
import { builtWorkerFile } from './built-worker'
import { runBarModelTask, type BarModelReply, type BarModelTask } from '../../shared/barModel/runBarModelTask'

/** Tasks waiting for the thread before new ones are refused. */
export const BAR_MODEL_MAX_QUEUE = 16
const RETRY_AFTER_S = 3

export class BarModelBusyError extends Error {
  readonly retryAfterS = RETRY_AFTER_S
  constructor() {
    super('The server is working out as many bar models as it can right now; ask again in a few seconds.')
    this.name = 'BarModelBusyError'
  }
}

export interface BarModelPool {
  run(task: BarModelTask): Promise<BarModelReply>
  close(): Promise<void>
}

let current: BarModelPool | undefined

/**
 * One worker thread for the bar model: cut plans and blank grades (occasional work of
 * tens to hundreds of ms; the analysis pool needs the cores),
 * started on first use. Without a built worker (scripts, `nuxt dev`) plans run in this thread.
 */
export function useBarModelPool(): BarModelPool {
  if (current) return current
  const file = builtWorkerFile('bar-model')
  if (!file) {
    current = {
      run: async task => runBarModelTask(task),
      close: async () => {},
    }
    return current
  }
  const piscina = new Piscina<BarModelTask, BarModelReply>({ filename: pathToFileURL(file).href, minThreads: 0, maxThreads: 1, idleTimeout: 60_000, maxQueue: BAR_MODEL_MAX_QUEUE })
  current = {
    run: (task) => {
      if (piscina.queueSize >= BAR_MODEL_MAX_QUEUE) return Promise.reject(new BarModelBusyError())
      return piscina.run(task).catch((error: unknown) => {
        if (error instanceof Error && /queue is at limit/i.test(error.message)) throw new BarModelBusyError()
        throw error
      })
    },
    close: () => piscina.destroy(),
  }
  return current
}

export async function closeBarModelPool() {
  const pool = current
  current = undefined
  await pool?.close()
}
