import { readdirSync, readFileSync } from 'node:fs'
import { getPriority } from 'node:os'
import { afterAll, describe, expect, it } from 'vitest'
import { AnalysisError } from '../../../../shared/analysis/AnalysisError'
import { analyzeStrike } from '../../../../shared/analysis/analyzeStrike'
import { encodeWav } from '../../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'
import { AnalysisBusyError, createAnalysisPool, locateWorker } from '../../../../server/utils/analysis-pool'
import { audioFixture } from '../../../support/audioFixture'

const fixture = audioFixture

describe('analysis pool (worker threads from the TypeScript source through tsx)', () => {
  const pool = createAnalysisPool({ threads: 1, maxQueue: 1 })
  afterAll(() => pool.close())

  it('runs in a worker thread and gives the same result as the engine in this thread', async () => {
    expect(pool.mode).toBe('pool')
    expect(pool.workerFile).toMatch(/server\/workers\/analysis\.worker\.ts$/)
    const bytes = fixture('strike-48k.flac')
    const options = { targetHz: 440, ratios: [1, 2.7565], tolerances: [5, 10] }
    expect(await pool.run(bytes, options)).toEqual(await analyzeStrike(bytes, options))
  }, 60_000)

  it('runs its threads at nice 10 and leaves the request thread at its own priority', async () => {
    const before = getPriority()
    await pool.measure(fixture('strike-48k.flac'), { targetHz: 440 })
    // Niceness of every thread of this process: field 19 of /proc/<pid>/task/<tid>/stat (source: proc(5)).
    const niceness = readdirSync('/proc/self/task')
      .map(t => Number(readFileSync(`/proc/self/task/${t}/stat`, 'utf8').split(') ')[1]!.split(' ')[16]))
    expect(niceness).toContain(10)
    expect(getPriority()).toBe(before)
  }, 60_000)

  it('measure brings the result and its JSON text, written once in the worker, with the caller\'s bytes untouched', async () => {
    const bytes = fixture('strike-48k.flac')
    const before = Buffer.from(bytes)
    const { result, json } = await pool.measure(bytes, { targetHz: 440 })
    expect(JSON.parse(json)).toEqual(JSON.parse(JSON.stringify(result)))
    expect(json).toBe(JSON.stringify(result))
    expect(Buffer.from(bytes).equals(before)).toBe(true)
  }, 60_000)

  it('measures a reference tone in the worker thread (calibrate), the caller\'s bytes untouched', async () => {
    // A 1000 Hz reference on an input reading 300 ppm high (issue 15's check), SNR ≈ 31 dB.
    const bytes = encodeWav(synthStrike([{ frequencyHz: 1000 * (1 + 300e-6), amplitudeDb: -6, decayDbPerS: 0 }], { sampleRate: 48000, durationS: 4, noiseDb: -40, seed: 6 }), 48000)
    const before = Buffer.from(bytes)
    const offset = await pool.calibrate({ bytes, referenceHz: 1000 })
    expect(Math.abs(offset.offsetPpm - 300)).toBeLessThan(2)
    expect(Buffer.from(bytes).equals(before)).toBe(true)
    await expect(pool.calibrate({ bytes, referenceHz: 30000 })).rejects.toMatchObject({ name: 'AnalysisError', status: 400 })
  }, 60_000)

  it('brings a refusal back as an AnalysisError with its status and sentence', async () => {
    const error = await pool.run(fixture('not-audio.txt'), {}).catch(e => e)
    expect(error).toBeInstanceOf(AnalysisError)
    expect(error).toMatchObject({ status: 415, code: 'not_audio' })
    expect(error.message).toMatch(/^The file is not audio/)
  }, 60_000)

  it('refuses at once with AnalysisBusyError when the queue is full (1 thread, 1 waiting)', async () => {
    const bytes = fixture('strike-48k.flac')
    const outcomes = await Promise.allSettled([1, 2, 3, 4].map(() => pool.run(bytes, {})))
    const busy = outcomes.filter(o => o.status === 'rejected' && o.reason instanceof AnalysisBusyError)
    const done = outcomes.filter(o => o.status === 'fulfilled')
    expect(busy.length).toBeGreaterThanOrEqual(2)
    expect(done.length).toBeGreaterThanOrEqual(1)
    expect(busy.length + done.length).toBe(4)
    expect((busy[0] as PromiseRejectedResult).reason.retryAfterS).toBe(5)
  }, 60_000)
})

describe('analysis pool time limit (the backstop behind the engine\'s own)', () => {
  it('stops a task past maxTaskS with a 422 in plain words, and a pool with room measures the same strike', async () => {
    const strict = createAnalysisPool({ threads: 1, maxQueue: 2, maxTaskS: 0.05 })
    try {
      // 4 s of a real strike takes far more than 50 ms in a cold worker.
      const error = await strict.run(fixture('strike-48k.flac'), { targetHz: 440 }).catch(e => e)
      expect(error).toBeInstanceOf(AnalysisError)
      expect(error).toMatchObject({ status: 422, code: 'too_slow_to_measure' })
      expect(error.message).toMatch(/^Measuring this recording was stopped after 0\.05 s;/)
    }
    finally {
      await strict.close()
    }
    const relaxed = createAnalysisPool({ threads: 1, maxQueue: 2, maxTaskS: 120 })
    try {
      expect((await relaxed.run(fixture('strike-48k.flac'), { targetHz: 440 })).partials.length).toBeGreaterThan(0)
    }
    finally {
      await relaxed.close()
    }
  }, 120_000)
})

describe('locateWorker', () => {
  it('never offers the TypeScript source to a production process', () => {
    // No build beside this source tree's server/utils: production finds nothing, development the source.
    expect(locateWorker(true)).toBeNull()
    expect(locateWorker(false)).toMatchObject({ typescript: true })
  })
})
