import { existsSync } from 'node:fs'
import { availableParallelism } from 'node:os'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { Piscina } from 'piscina'
import { AnalysisError } from '../../shared/analysis/AnalysisError'
import { LIMITS } from '../../shared/analysis/limits'
import type { AnalysisResult, AnalyzeOptions } from '../../shared/analysis/types'
import type { ClockOffset } from '../../shared/calibration/measureClockOffset'
import type { AnalysisReply, AnalysisTask, CalibrationReply, CalibrationTask } from '../workers/analysis.worker'

/** The bundled worker's name beside the built server (`.output/server/workers/`). */
export const BUILT_WORKER = join('workers', 'analysis.mjs')
const SOURCE_WORKER = join('server', 'workers', 'analysis.worker.ts')

export interface AnalysisPoolOptions {
  /** Worker threads; 0 or absent: the machine's available parallelism. */
  threads?: number
  /** Tasks that may wait for a thread; 0 or absent: twice the threads. */
  maxQueue?: number
  /** A worker file to use instead of the one found beside the build or in the source tree. */
  workerFile?: string
  /** Seconds a refused client is told to wait (Retry-After). */
  retryAfterS?: number
  /**
   * Seconds from submission after which a task's thread is stopped (default 6 × LIMITS.maxMeasureS): a
   * backstop behind the engine's own limit, for a decode or a step that never reaches a check.
   */
  maxTaskS?: number
}

/** The queue is full: answer 503 with Retry-After rather than pile work up. */
export class AnalysisBusyError extends Error {
  readonly retryAfterS: number
  constructor(retryAfterS: number) {
    super('The server is measuring as many strikes as it can right now; send this one again in a few seconds.')
    this.name = 'AnalysisBusyError'
    this.retryAfterS = retryAfterS
  }
}

/** A measurement and its JSON text (made by the worker, so the request thread never serialises it). */
export interface MeasuredStrike {
  result: AnalysisResult
  json: string
}

export interface AnalysisPool {
  readonly threads: number
  readonly maxQueue: number
  /** 'pool' runs in worker threads; 'in-thread' is the development fallback. */
  readonly mode: 'pool' | 'in-thread'
  readonly workerFile: string | null
  run(bytes: Uint8Array, options: AnalyzeOptions): Promise<AnalysisResult>
  /** As run, with the result's JSON text beside it. */
  measure(bytes: Uint8Array, options: AnalyzeOptions): Promise<MeasuredStrike>
  /** The clock offset of the input that recorded a reference tone (the same threads and queue bound). */
  calibrate(task: CalibrationTask): Promise<ClockOffset>
  close(): Promise<void>
}

/**
 * Where the worker is: the bundle beside the built server (found upward from the entry
 * script `.output/server/index.mjs` and from this module), else the TypeScript source run
 * through tsx's loader (tests, scripts, `nuxt dev`). A production process never loads
 * TypeScript: without the bundle it has no worker.
 */
export function locateWorker(production = process.env.NODE_ENV === 'production'): { file: string, typescript: boolean } | null {
  // Nitro rewrites import.meta.url to the entry's URL, which is not yet set while plugins
  // load; the entry script's path (argv[1]) is.
  const starts = [process.argv[1] ? dirname(resolve(process.argv[1])) : null, dirname(fileURLToPath(import.meta.url))]
  for (const start of starts) {
    if (!start) continue
    let dir = start
    for (let i = 0; i < 4; i++, dir = dirname(dir)) {
      if (existsSync(join(dir, BUILT_WORKER))) return { file: join(dir, BUILT_WORKER), typescript: false }
    }
  }
  if (production) return null
  for (const root of [resolve(dirname(fileURLToPath(import.meta.url)), '../..'), process.cwd()]) {
    if (existsSync(join(root, SOURCE_WORKER))) return { file: join(root, SOURCE_WORKER), typescript: true }
  }
  return null
}

function decodeReply(reply: AnalysisReply): MeasuredStrike {
  if (reply.ok) return { result: reply.result, json: reply.json }
  throw new AnalysisError(reply.status, reply.code, reply.message)
}

function decodeCalibration(reply: CalibrationReply): ClockOffset {
  if (reply.ok) return reply.offset
  throw new AnalysisError(reply.status, reply.code, reply.message)
}

/**
 * A bounded pool of worker threads for decoding and measuring strikes, so the thread
 * that answers requests never does that work. When more than `maxQueue` tasks wait,
 * `run` rejects at once with AnalysisBusyError.
 */
export function createAnalysisPool(options: AnalysisPoolOptions = {}): AnalysisPool {
  const threads = options.threads && options.threads > 0 ? Math.floor(options.threads) : availableParallelism()
  const maxQueue = options.maxQueue && options.maxQueue > 0 ? Math.floor(options.maxQueue) : 2 * threads
  const retryAfterS = options.retryAfterS ?? 5
  const maxTaskS = options.maxTaskS && options.maxTaskS > 0 ? options.maxTaskS : 6 * LIMITS.maxMeasureS
  const located = options.workerFile
    ? { file: resolve(options.workerFile), typescript: options.workerFile.endsWith('.ts') }
    : locateWorker()
  if (!located) {
    if (process.env.NODE_ENV === 'production') {
      throw new Error(`The analysis worker (${BUILT_WORKER}) is missing beside the built server; rebuild with \`nuxt build\`.`)
    }
    console.warn('Tonewright: no analysis worker found; strikes are measured on the request thread (development only).')
    return inThreadPool(threads, maxQueue, retryAfterS)
  }
  const execArgv = located.typescript && !process.execArgv.some(a => a.includes('tsx')) ? [...process.execArgv, '--import', 'tsx'] : process.execArgv
  const piscina = new Piscina<AnalysisTask | CalibrationTask, AnalysisReply | CalibrationReply>({
    filename: pathToFileURL(located.file).href,
    minThreads: threads,
    maxThreads: threads,
    maxQueue,
    // A strike takes well under a second; an idle thread stays warm (decoders compiled).
    idleTimeout: 60_000,
    execArgv,
    name: 'default',
  })
  const measure = async (bytes: Uint8Array, analyzeOptions: AnalyzeOptions): Promise<MeasuredStrike> => {
    if (piscina.queueSize >= maxQueue) throw new AnalysisBusyError(retryAfterS)
    let reply: AnalysisReply
    try {
      // The upload is a view into the whole request body: copy just its bytes and hand
      // that copy over (a plain clone would copy the whole body buffer).
      const own = bytes.slice()
      reply = await piscina.run({ bytes: own, options: analyzeOptions }, { transferList: [own.buffer], signal: AbortSignal.timeout(maxTaskS * 1000) }) as AnalysisReply
    }
    catch (error) {
      throw busyOr(error, retryAfterS, maxTaskS)
    }
    return decodeReply(reply)
  }
  const calibrate = async (task: CalibrationTask): Promise<ClockOffset> => {
    if (piscina.queueSize >= maxQueue) throw new AnalysisBusyError(retryAfterS)
    let reply: CalibrationReply
    try {
      const own = task.bytes.slice()
      reply = await piscina.run({ ...task, bytes: own }, { name: 'calibrate', transferList: [own.buffer], signal: AbortSignal.timeout(maxTaskS * 1000) }) as CalibrationReply
    }
    catch (error) {
      throw busyOr(error, retryAfterS, maxTaskS)
    }
    return decodeCalibration(reply)
  }
  return {
    threads,
    maxQueue,
    mode: 'pool',
    workerFile: located.file,
    measure,
    calibrate,
    run: async (bytes, analyzeOptions) => (await measure(bytes, analyzeOptions)).result,
    close: () => piscina.close({ force: true }),
  }
}

/** Development fallback without a worker: the same bound on waiting tasks, on this thread. */
function inThreadPool(threads: number, maxQueue: number, retryAfterS: number): AnalysisPool {
  let waiting = 0
  const measure = async (bytes: Uint8Array, options: AnalyzeOptions): Promise<MeasuredStrike> => {
    if (waiting >= maxQueue + threads) throw new AnalysisBusyError(retryAfterS)
    waiting++
    try {
      // Loaded only here, so the server bundle does not carry the engine.
      const { default: analyze } = await import('../workers/analysis.worker')
      return decodeReply(await analyze({ bytes, options }))
    }
    finally {
      waiting--
    }
  }
  const calibrate = async (task: CalibrationTask): Promise<ClockOffset> => {
    if (waiting >= maxQueue + threads) throw new AnalysisBusyError(retryAfterS)
    waiting++
    try {
      const { calibrate: measureTone } = await import('../workers/analysis.worker')
      return decodeCalibration(await measureTone(task))
    }
    finally {
      waiting--
    }
  }
  return {
    threads,
    maxQueue,
    mode: 'in-thread',
    workerFile: null,
    measure,
    calibrate,
    run: async (bytes, options) => (await measure(bytes, options)).result,
    close: async () => {},
  }
}

/**
 * Piscina's refusal of a full queue as AnalysisBusyError; a task stopped at its time limit (its
 * thread is ended and replaced) as a 422 in plain words; anything else as it came.
 */
function busyOr(error: unknown, retryAfterS: number, maxTaskS: number): unknown {
  if (error instanceof Error && /queue is at limit|all workers are busy/i.test(error.message)) return new AnalysisBusyError(retryAfterS)
  if (error instanceof Error && (error.name === 'AbortError' || /aborted/i.test(error.message))) {
    return new AnalysisError(422, 'too_slow_to_measure', `Measuring this recording was stopped after ${maxTaskS} s; record a single strike of the piece in a quiet room and send it again.`)
  }
  return error
}

let current: AnalysisPool | undefined

/** Sets the process's pool (the Nitro plugin does this at start from runtime config). */
export function setAnalysisPool(pool: AnalysisPool | undefined): void {
  current = pool
}

/** The process's pool, created with the defaults when nothing configured one (scripts). */
export function useAnalysisPool(): AnalysisPool {
  current ??= createAnalysisPool()
  return current
}
