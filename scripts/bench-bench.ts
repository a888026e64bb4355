/**
 * Bench speed: from the end of a 3 s recording to the partial ladder drawn on screen
 * (WAV encoding, upload, analysis, save, render), on loopback, in headless Chromium
 * with a synthetic strike played by the fake microphone. Prints the median over 10 strikes.
 *
 *   npx tsx scripts/bench-bench.ts            # against http://127.0.0.1:3000 (npm start)
 *   TW_BASE_URL=http://127.0.0.1:3301 npx tsx scripts/bench-bench.ts
 *
 * It signs up a throw-away workshop of its own, so the demo workshop is left alone.
 */
import { randomUUID } from 'node:crypto'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { cpus, loadavg, tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium } from 'playwright-core'
import { benchStrikeWav } from '../tests/support/benchStrike'

const BASE = process.env.TW_BASE_URL ?? 'http://127.0.0.1:3000'
const STRIKES = Number(process.env.TW_BENCH_STRIKES ?? 10)

async function call(path: string, token: string | null, method = 'GET', body?: unknown) {
  const headers: Record<string, string> = { accept: 'application/json' }
  if (token) headers.authorization = `Bearer ${token}`
  if (body !== undefined) headers['content-type'] = 'application/json'
  const r = await fetch(`${BASE}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) })
  const text = await r.text()
  if (r.status >= 300) throw new Error(`${method} ${path}: ${r.status} ${text}`)
  return text ? JSON.parse(text) : null
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b)
  return s.length % 2 ? s[s.length >> 1]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2
}

async function main() {
  try {
    await fetch(`${BASE}/api/health`)
  }
  catch {
    console.error(`No Tonewright server at ${BASE}. Start one with \`npm start\` (or set TW_BASE_URL).`)
    process.exit(2)
  }
  const email = `bench-${randomUUID().slice(0, 8)}@example.test`
  const password = 'bench-speed-password'
  const signup = await call('/api/auth/signup', null, 'POST', { name: 'Speed Bench', email, password, workshopName: 'Bench speed workshop' })
  const token = signup.token as string
  const templates = await call('/api/templates', token)
  const list = (Array.isArray(templates) ? templates : templates.items) as { id: string, name: string }[]
  const template = list.find(t => t.name.startsWith('Marimba bar, triple'))!
  const serial = `SPD-${randomUUID().slice(0, 6)}`
  const set = await call('/api/sets', token, 'POST', {
    name: 'Speed marimba', model: 'Practice marimba', serial, buyer: { name: 'Speed Buyer', email: 'speed@example.test' },
    referenceHz: 440, fromNote: 'C4', toNote: 'C4', chromatic: true, templateId: template.id,
  })
  const piece = (await call(`/api/sets/${set.id}`, token)).pieces[0] as { id: string }

  const dir = mkdtempSync(join(tmpdir(), 'tw-bench-speed-'))
  const mic = join(dir, 'strike-C4.wav')
  // 0.6 s lead-in, then a ring longer than the 3 s maximum: every take is a 3 s recording.
  writeFileSync(mic, benchStrikeWav('C4', { centsByPartial: [3, 0, -14], leadInS: 0.6, ringS: 3.4, sampleRate: 44100 }))
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium', headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream', `--use-file-for-fake-audio-capture=${mic}`],
  })
  try {
    const page = await (await browser.newContext({ viewport: { width: 1280, height: 800 } })).newPage()
    await page.goto(`${BASE}/signin`)
    await page.getByLabel('E-mail').fill(email)
    await page.getByLabel('Password').fill(password)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(url => !url.pathname.startsWith('/signin'))
    await page.goto(`${BASE}/bench?piece=${piece.id}`)
    await page.getByTestId('arm').waitFor()

    const total: number[] = []
    const server: number[] = []
    const render: number[] = []
    const lengths: number[] = []
    let rate = 0
    let dropped = 0
    for (let i = 0; i < STRIKES; i++) {
      await page.evaluate(() => performance.clearMarks())
      await page.getByTestId('arm').click()
      await page.waitForFunction(() => performance.getEntriesByName('tw:ladder-drawn').length > 0, null, { timeout: 30_000 })
      // A string, not a function: tsx would wrap a function's inner helpers in its own __name().
      const t = await page.evaluate(`(() => {
        const m = n => performance.getEntriesByName(n)[0]
        return { dropped: performance.getEntriesByName('tw:take-dropped').length, recorded: m('tw:strike-recorded').startTime, measured: m('tw:strike-measured').startTime, drawn: m('tw:ladder-drawn').startTime, take: m('tw:strike-recorded').detail }
      })()`) as { dropped: number, recorded: number, measured: number, drawn: number, take: { seconds: number, sampleRate: number } }
      total.push(t.drawn - t.recorded)
      server.push(t.measured - t.recorded)
      render.push(t.drawn - t.measured)
      lengths.push(t.take.seconds)
      dropped += t.dropped
      rate = t.take.sampleRate
      await page.getByTestId('capture-state').filter({ hasText: 'Listening' }).waitFor()
      process.stdout.write(`strike ${i + 1}: ${(t.drawn - t.recorded).toFixed(0)} ms\n`)
    }
    const ms = (x: number) => `${x.toFixed(0)} ms`
    console.log('')
    const takeS = median(lengths)
    console.log(`Bench speed over ${STRIKES} strikes on ${BASE}: recordings of ${takeS.toFixed(2)} s at ${rate} Hz (16-bit mono WAV, ${((44 + takeS * rate * 2) / 1024).toFixed(0)} KiB)`)
    console.log(`  end of recording → ladder drawn: median ${ms(median(total))} (min ${ms(Math.min(...total))}, max ${ms(Math.max(...total))}); goal < 500 ms: ${median(total) < 500 ? 'met' : 'NOT met'}`)
    console.log(`    encode + upload + analysis + save: median ${ms(median(server))}`)
    console.log(`    render of the result:              median ${ms(median(render))}`)
    console.log(`  takes discarded for an input dropout (re-armed by themselves): ${dropped}`)
    console.log(`  machine: ${cpus().length} cores, load average ${loadavg().map(l => l.toFixed(1)).join(' / ')} (1 / 5 / 15 min); a loaded machine slows the server's share`)
  }
  finally {
    await browser.close()
    rmSync(dir, { recursive: true, force: true })
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error)
  process.exit(1)
})
