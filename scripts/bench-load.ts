/**
 * npm run bench:load: many benchmakers at once against a running server (`npm start`, or
 * TW_BASE_URL); starts nothing itself and signs up a throw-away workshop of its own.
 *
 *   npm run bench:load [-- --requests 24 --in-flight 4 --engine-runs 8]
 *
 * With a real strike (the whole tubular-bells-c5 recording, 9 s, rendered if missing: longer
 * than a 4 s strike, so the rates are lower; the ratios compare the same file) it prints:
 * POST /api/analyze and POST /api/pieces/:id/strikes throughput (strikes/s) and latency
 * (p50/p95) with `--in-flight` requests at a time, /api/health latency polled all along,
 * the engine's single-thread rate in this process on the same file (measured before and
 * after the requests; their mean is the reference) and the ratios against the goals.
 * The machine's load average is printed beside the figures: they move with it.
 */
import { readFileSync } from 'node:fs'
import { loadavg } from 'node:os'
import { parseArgs } from 'node:util'
import { analyzeStrike } from '../shared/analysis/analyzeStrike'
import { realFixturePath, realFixtures } from '../tests/support/realFixtures'

const BASE = (process.env.TW_BASE_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, '')
const { values } = parseArgs({
  options: {
    'requests': { type: 'string', default: '24' },
    'in-flight': { type: 'string', default: '4' },
    'engine-runs': { type: 'string', default: '8' },
  },
})
const REQUESTS = Number(values.requests)
const IN_FLIGHT = Number(values['in-flight'])
const ENGINE_RUNS = Number(values['engine-runs'])
const GOALS = { analyzeRatio: 1.3, strikeRatio: 1.0, healthMs: 250 }

const fixture = realFixtures().find(f => f.id === 'tubular-bells-c5')!
const bytes = new Uint8Array(readFileSync(realFixturePath(fixture)))
const options = { targetHz: fixture.targetHz, ratios: fixture.ratios }

const load = () => loadavg().map(x => x.toFixed(2)).join(' ')
const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(q * xs.length))] ?? Number.NaN
const ms = (x: number) => `${x.toFixed(0)} ms`

async function call(path: string, init: RequestInit & { token?: string } = {}) {
  const headers: Record<string, string> = { origin: BASE, ...(init.token ? { authorization: `Bearer ${init.token}` } : {}) }
  if (typeof init.body === 'string') headers['content-type'] = 'application/json'
  const reply = await fetch(`${BASE}${path}`, { ...init, headers })
  const text = await reply.text()
  if (!reply.ok) throw new Error(`${init.method ?? 'GET'} ${path}: ${reply.status} ${text.slice(0, 200)}`)
  return JSON.parse(text)
}

/** The engine alone on one thread: strikes per second after a warm-up. */
async function engineRate(runs: number): Promise<number> {
  for (let i = 0; i < 2; i++) await analyzeStrike(bytes, options)
  const started = performance.now()
  for (let i = 0; i < runs; i++) await analyzeStrike(bytes, options)
  return runs / ((performance.now() - started) / 1000)
}

/** Sends `total` uploads made by `form(i)` to `path(i)`, `IN_FLIGHT` at a time. */
async function hammer(total: number, path: (slot: number) => string, form: () => FormData, token: string) {
  const latencies: number[] = []
  const statuses = new Map<number, number>()
  let next = 0
  const started = performance.now()
  await Promise.all(Array.from({ length: IN_FLIGHT }, async (_, slot) => {
    while (next < total) {
      next++
      const t = performance.now()
      const reply = await fetch(`${BASE}${path(slot)}`, { method: 'POST', headers: { authorization: `Bearer ${token}` }, body: form() })
      await reply.arrayBuffer()
      latencies.push(performance.now() - t)
      statuses.set(reply.status, (statuses.get(reply.status) ?? 0) + 1)
    }
  }))
  const seconds = (performance.now() - started) / 1000
  const errors = [...statuses].filter(([status]) => status >= 300).reduce((n, [, k]) => n + k, 0)
  return { rate: total / seconds, latencies, statuses, errors }
}

function upload(fields: Record<string, string>) {
  return () => {
    const form = new FormData()
    form.set('file', new Blob([bytes], { type: 'audio/wav' }), `${fixture.id}.wav`)
    for (const [k, v] of Object.entries(fields)) form.set(k, v)
    return form
  }
}

/** Polls /api/health until stopped, one request after another with 50 ms between. */
function pollHealth() {
  const times: number[] = []
  let failures = 0
  let running = true
  const done = (async () => {
    while (running) {
      const t = performance.now()
      try {
        const reply = await fetch(`${BASE}/api/health`)
        await reply.arrayBuffer()
        if (!reply.ok) failures++
      }
      catch {
        failures++
      }
      times.push(performance.now() - t)
      await new Promise(resolve => setTimeout(resolve, 50))
    }
  })()
  const stop = async () => {
    running = false
    await done
  }
  return { times, failures: () => failures, stop }
}

console.log(`bench:load against ${BASE}: ${fixture.id} (${(bytes.byteLength / 1e6).toFixed(2)} MB WAV), ${REQUESTS} requests per route, ${IN_FLIGHT} in flight`)
console.log(`load average at start: ${load()}`)
const engineBefore = await engineRate(ENGINE_RUNS)
console.log(`engine in-process, one thread (before): ${engineBefore.toFixed(2)} strikes/s (${ENGINE_RUNS} runs)`)

const email = `bench-load-${Date.now()}@example.test`
const { token } = await call('/api/auth/signup', { method: 'POST', body: JSON.stringify({ name: 'Load Bench', email, password: 'bench-load-password-1', workshopName: 'Load bench workshop' }) })
const templates = await call('/api/templates', { token })
// One single-piece set per request slot, so parallel strikes never wait for one piece's lock.
const pieceIds: string[] = []
for (let slot = 0; slot < IN_FLIGHT; slot++) {
  const set = await call('/api/sets', {
    method: 'POST', token, body: JSON.stringify({
      name: `Load ${slot}`, model: 'Chime', serial: `LOAD-${Date.now()}-${slot}`, buyer: { name: 'Load Buyer', email: 'buyer@example.test' },
      referenceHz: 440, fromNote: 'C5', toNote: 'C5', chromatic: true, templateId: templates[0].id,
    }),
  })
  const page = await call(`/api/pieces?set=${set.id}`, { token })
  pieceIds.push(page.items[0].id)
}

const health = pollHealth()
const analyzeForm = upload({ 'target-hz': String(fixture.targetHz), 'ratios': fixture.ratios.join(',') })
await hammer(IN_FLIGHT, () => '/api/analyze', analyzeForm, token) // warm-up: every worker thread decodes once
const analyzed = await hammer(REQUESTS, () => '/api/analyze', analyzeForm, token)
const strikeForm = upload({ temperatureC: '21' })
const recorded = await hammer(REQUESTS, slot => `/api/pieces/${pieceIds[slot]}/strikes`, strikeForm, token)
await health.stop()
const loadDuring = load()
const engineAfter = await engineRate(ENGINE_RUNS)
const engine = (engineBefore + engineAfter) / 2

const line = (label: string, r: Awaited<ReturnType<typeof hammer>>, goal: number) =>
  `${label} ${r.rate.toFixed(2)} strikes/s, p50 ${ms(quantile(r.latencies, 0.5))}, p95 ${ms(quantile(r.latencies, 0.95))}; `
  + `${(r.rate / engine).toFixed(2)}× the engine (goal ≥ ${goal.toFixed(1)}×: ${r.rate / engine >= goal ? 'met' : 'not met'}); `
  + `statuses ${[...r.statuses].map(([s, n]) => `${s}×${n}`).join(', ')}`
const healthMax = Math.max(...health.times)
console.log(`engine in-process, one thread (after):  ${engineAfter.toFixed(2)} strikes/s; reference (mean) ${engine.toFixed(2)} strikes/s`)
console.log(line('POST /api/analyze:            ', analyzed, GOALS.analyzeRatio))
console.log(line('POST /api/pieces/:id/strikes: ', recorded, GOALS.strikeRatio))
console.log(`GET /api/health during both:  p50 ${ms(quantile(health.times, 0.5))}, p95 ${ms(quantile(health.times, 0.95))}, max ${ms(healthMax)} `
  + `(${health.times.length} polls, ${health.failures()} failed; goal < ${GOALS.healthMs} ms: ${healthMax < GOALS.healthMs ? 'met' : 'not met'})`)
const errors = analyzed.errors + recorded.errors + health.failures()
console.log(`errors: ${errors}; load average after the requests: ${loadDuring}`)
