/**
 * Health latency while long recordings are measured, and the analysis pool's throughput,
 * against a running server (`npm start`, or TW_BASE_URL). Signs up a throw-away workshop.
 *
 *   npx tsx scripts/bench-health-during-analysis.ts [--long 3] [--strikes 24] [--in-flight 4]
 *
 * Prints: /api/health p50/max on the idle server, the same while `--long` 58 s recordings
 * are measured at once, and strikes/s for `--strikes` 4 s recordings with `--in-flight`
 * requests at a time. Also the time to refuse two decode bombs.
 */
import { parseArgs } from 'node:util'
import { analyzeStrike } from '../shared/analysis/analyzeStrike'
import { encodeWav } from '../shared/analysis/encodeWav'
import { synthStrike } from '../shared/synthesis/synthStrike'
import { flacBomb, opusBomb } from '../tests/support/audioBombs'

const BASE = process.env.TW_BASE_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`
const { values } = parseArgs({ options: { 'long': { type: 'string', default: '2' }, 'strikes': { type: 'string', default: '24' }, 'in-flight': { type: 'string', default: '4' } } })

const recording = (durationS: number, seed: number) => encodeWav(synthStrike(
  [{ frequencyHz: 440, amplitudeDb: -10, decayDbPerS: 60 / durationS }, { frequencyHz: 1212.86, amplitudeDb: -16, decayDbPerS: 90 / durationS }],
  { sampleRate: 48000, durationS, onsetS: 0.05, noiseDb: -75, seed },
), 48000)

async function signUp(): Promise<string> {
  const email = `bench-${Date.now()}@example.test`
  const reply = await fetch(`${BASE}/api/auth/signup`, {
    method: 'POST', headers: { 'content-type': 'application/json', 'origin': BASE },
    body: JSON.stringify({ name: 'Bench Runner', email, password: 'bench-password-123', workshopName: 'Bench workshop' }),
  })
  if (reply.status !== 200) throw new Error(`sign-up failed: ${reply.status} ${await reply.text()}`)
  return (await reply.json()).token
}

async function analyze(token: string, bytes: Uint8Array, name = 'strike.wav'): Promise<{ status: number, ms: number }> {
  const form = new FormData()
  form.set('file', new Blob([bytes]), name)
  form.set('target-hz', '440')
  const started = performance.now()
  const reply = await fetch(`${BASE}/api/analyze`, { method: 'POST', headers: { authorization: `Bearer ${token}` }, body: form })
  await reply.arrayBuffer()
  return { status: reply.status, ms: performance.now() - started }
}

async function healthWhile(busy: () => boolean): Promise<number[]> {
  const times: number[] = []
  while (busy()) {
    const started = performance.now()
    await (await fetch(`${BASE}/api/health`)).arrayBuffer()
    times.push(performance.now() - started)
    await new Promise(resolve => setTimeout(resolve, 20))
  }
  return times
}

const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(q * xs.length))] ?? Number.NaN
const figures = (xs: number[]) => `p50 ${quantile(xs, 0.5).toFixed(1)} ms, max ${Math.max(...xs).toFixed(1)} ms (${xs.length} requests)`

const token = await signUp()
let idleUntil = performance.now() + 2000
console.log(`idle server:                /api/health ${figures(await healthWhile(() => performance.now() < idleUntil))}`)

// Two forms of the same length: a 5.6 MB WAV (its upload is read on the request thread
// first) and a 2 kB stereo FLAC of one-second steps (almost nothing to read; only the measurement).
const longFlac = flacBomb({ declaredFrames: 58 * 48000, blocks: 58, blockSize: 48000, channels: 2, value: [8000, -8000, 4000, -4000, 12000, -12000, 2000] })
for (const [label, bytes, name] of [['58 s WAV (5.6 MB)', recording(58, 1), 'long.wav'], ['58 s FLAC (2 kB)', longFlac, 'long.flac']] as const) {
  let pending = Number(values.long)
  const runs = Array.from({ length: pending }, () => analyze(token, bytes, name).finally(() => pending--))
  const during = await healthWhile(() => pending > 0)
  const results = await Promise.all(runs)
  console.log(`${values.long} × ${label} measured: /api/health ${figures(during)}; analyses ${results.map(r => `${r.status} in ${r.ms.toFixed(0)} ms`).join(', ')}`)
}

const short = recording(4, 2)
await analyze(token, short) // warm-up
const total = Number(values.strikes)
const inFlight = Number(values['in-flight'])
let next = 0
const statuses: number[] = []
const started = performance.now()
await Promise.all(Array.from({ length: inFlight }, async () => {
  while (next < total) {
    next++
    statuses.push((await analyze(token, short)).status)
  }
}))
const seconds = (performance.now() - started) / 1000
console.log(`pool throughput:            ${(total / seconds).toFixed(2)} strikes/s (4 s recordings, ${inFlight} in flight, statuses ${[...new Set(statuses)].join('/')})`)

for (const [name, bytes, file] of [
  ['FLAC declaring 2 h', flacBomb({ declaredFrames: 48000 * 7200, blocks: 3 }), 'bomb.flac'],
  ['Ogg Opus declaring 2 h', opusBomb({ declaredFrames: 48000 * 7200, pages: 2 }), 'bomb.opus'],
  ['FLAC with no length, 23 min mono', flacBomb({ declaredFrames: 0, blocks: 1000 }), 'quiet.flac'],
  ['FLAC with no length, 5.7 min × 8 channels', flacBomb({ declaredFrames: 0, blocks: 250, channels: 8 }), 'quiet8.flac'],
] as const) {
  const r = await analyze(token, bytes, file)
  console.log(`decode bomb: ${name} (${bytes.length} B): ${r.status} in ${r.ms.toFixed(1)} ms`)
}

// The engine alone on this machine, for comparison with the pool's rate above.
const inProcessStarted = performance.now()
for (let i = 0; i < 8; i++) await analyzeStrike(short, { targetHz: 440 })
console.log(`engine in this process:     ${(8 / ((performance.now() - inProcessStarted) / 1000)).toFixed(2)} strikes/s (same 4 s recording, one thread)`)
idleUntil = 0
