import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { encodeWav } from '../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../shared/synthesis/synthStrike'
import { flacBomb } from '../../support/audioBombs'
import { api, BASE_URL, memberWithRole, newWorkshop } from '../support/http'
import { startServer, type ExtraServer } from '../support/server'

/**
 * A long recording in a small upload: `seconds` of stereo 48 kHz FLAC in steps of one
 * second (CONSTANT subframes), about 20 bytes a second. A small upload keeps the time spent
 * reading the request out of the picture, so the test sees only where the measurement runs.
 */
const longFlac = (seconds: number) =>
  flacBomb({ declaredFrames: seconds * 48000, blocks: seconds, blockSize: 48000, channels: 2, value: [8000, -8000, 4000, -4000, 12000, -12000, 2000] })

function analyze(token: string, bytes: Uint8Array, base = BASE_URL) {
  const form = new FormData()
  form.set('file', new Blob([bytes], { type: 'application/octet-stream' }), 'long.flac')
  form.set('target-hz', '440')
  return fetch(`${base}/api/analyze`, { method: 'POST', headers: { authorization: `Bearer ${token}`, accept: 'application/json' }, body: form })
}

describe('class: analysis never runs on the thread that answers requests (worker pool)', () => {
  let owner: Awaited<ReturnType<typeof newWorkshop>>
  beforeAll(async () => {
    owner = await newWorkshop('Pool workshop')
  })

  it('GET /api/health keeps answering while two 58 s recordings are measured', async () => {
    let analysesDone = 0
    const analyses = [analyze(owner.token, longFlac(58)), analyze(owner.token, longFlac(58))].map(p => p.then(async (r) => {
      analysesDone++
      return { status: r.status, body: await r.json() }
    }))
    // Let the uploads arrive, then ask for health one request after another until both are measured.
    await new Promise(resolve => setTimeout(resolve, 200))
    let answeredDuring = 0
    while (analysesDone < 2) {
      const reply = await fetch(`${BASE_URL}/api/health`)
      expect(reply.status).toBe(200)
      if (analysesDone < 2) answeredDuring++
    }
    const results = await Promise.all(analyses)
    for (const r of results) expect(r.status).toBe(200)
    // On the request thread, health would wait for each measurement (seconds each here);
    // in the pool it answers in milliseconds throughout.
    expect(answeredDuring).toBeGreaterThanOrEqual(5)
  }, 120_000)

  it('a refusal made in a worker reaches the client as its status and plain sentence', async () => {
    const silent = encodeWav(new Float64Array(48000), 48000)
    const reply = await analyze(owner.token, silent)
    expect(reply.status).toBe(422)
    const body = await reply.json()
    expect(body.message).toMatch(/^[A-Z][^\n]*\.$/)
    expect(JSON.stringify(body)).not.toMatch(/\bat .*:\d+:\d+/)
  })
})

describe('class: POST /api/analyze requires a member with the right to record strikes', () => {
  it('answers 401 without a session, 403 for the office role, 200 for a benchmaker', async () => {
    const owner = await newWorkshop('Analyze roles')
    const office = await memberWithRole(owner.token, 'office')
    const bench = await memberWithRole(owner.token, 'benchmaker')
    const short = encodeWav(synthStrike([{ frequencyHz: 440, amplitudeDb: -10, decayDbPerS: 10 }], { sampleRate: 48000, durationS: 1, onsetS: 0.05, noiseDb: -75, seed: 1 }), 48000)
    expect((await fetch(`${BASE_URL}/api/analyze`, { method: 'POST', body: new FormData() })).status).toBe(401)
    const refused = await analyze(office.token, short)
    expect(refused.status).toBe(403)
    expect((await refused.json()).message).toMatch(/office/)
    expect((await analyze(bench.token, short)).status).toBe(200)
  })
})

describe('class: a full analysis queue answers 503 with Retry-After, never 500', () => {
  let server: ExtraServer
  beforeAll(async () => {
    server = await startServer({ NUXT_ANALYSIS_THREADS: '1', NUXT_ANALYSIS_MAX_QUEUE: '1', NUXT_ANALYSIS_RETRY_AFTER_S: '7' })
  }, 120_000)
  afterAll(() => server?.stop())

  it('with one thread and one waiting place, six simultaneous 30 s recordings: some measured, the rest 503', async () => {
    const { token } = await newWorkshop('Busy workshop')
    const replies = await Promise.all(Array.from({ length: 6 }, () => analyze(token, longFlac(30), server.baseUrl)))
    const statuses = replies.map(r => r.status)
    const odd = replies.filter(r => r.status !== 200 && r.status !== 503)
    expect(odd.map(r => r.status), await Promise.all(odd.map(r => r.text())).then(t => t.join('\n'))).toEqual([])
    expect(statuses.filter(s => s === 200).length).toBeGreaterThanOrEqual(1)
    const busy = replies.filter(r => r.status === 503)
    expect(busy.length).toBeGreaterThanOrEqual(1)
    for (const r of busy) {
      expect(r.headers.get('retry-after')).toBe('7')
      expect((await r.json()).message).toMatch(/^The server is measuring as many strikes as it can right now; send this one again in a few seconds\.$/)
    }
    // The server still answers afterwards.
    expect((await api('/api/health')).status).toBe(200)
  }, 120_000)
})
