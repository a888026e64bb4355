import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ARTEFACTS, BASE_URL, launch, screenshot, signInAs, type Page } from '../../support/browser'
import { benchStrikeWav } from '../../../support/benchStrike'
import { createBenchSet, pieceOf } from '../../../support/benchSet'

// The fake microphone loops one 4 s recording with one strike in it (a quiet 0.6 s lead-in,
// then the ring), so an armed Bench hears a new strike every loop without anyone touching it.
let session: Awaited<ReturnType<typeof launch>>
let bench: Awaited<ReturnType<typeof createBenchSet>>
/** A one-piece set (C4) whose piece has no strike yet, for the portrait screen. */
let portrait: Awaited<ReturnType<typeof createBenchSet>>
const dir = mkdtempSync(join(tmpdir(), 'tw-bench-loop-'))

beforeAll(async () => {
  bench = await createBenchSet(BASE_URL)
  portrait = await createBenchSet(BASE_URL, 'C4', 'C4')
  const micFile = join(dir, 'fake-mic-C4.wav')
  // source: the synthesis itself — C4 at A4 = 440 Hz, partials +3, 0 and −14 ¢ from the targets
  writeFileSync(micFile, benchStrikeWav('C4', { centsByPartial: [3, 0, -14], sampleRate: 44100 }))
  session = await launch(['--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream', `--use-file-for-fake-audio-capture=${micFile}`])
})
afterAll(async () => {
  await session?.close()
})

async function openBench(page: Page, pieceId: string, viewport: { width: number, height: number }) {
  await page.setViewportSize(viewport)
  await signInAs(page, 'bench@tonewright.test')
  await page.goto(`${BASE_URL}/bench?piece=${pieceId}`)
  await page.getByTestId('bench-note').waitFor()
  await page.getByLabel('Temperature (°C)').fill('20')
}

/** Full page and what the window shows, both as artefacts. */
async function screens(page: Page, name: string) {
  await screenshot(page, name)
  await page.screenshot({ path: join(ARTEFACTS, `${name}-viewport.png`) })
}

async function strikeCount(note: string) {
  return (await pieceOf(BASE_URL, bench.token, bench.byNote(note).id)).strikeCount
}

describe('the Bench loop', () => {
  it('stays armed: three strikes are recorded with one tap before them and none between', async () => {
    const page = await session.newPage()
    await openBench(page, bench.byNote('C4').id, { width: 1280, height: 800 })
    expect(await page.getByTestId('stay-armed').isChecked()).toBe(true)
    await page.getByTestId('arm').click()
    await page.getByTestId('ladder-row').nth(2).waitFor({ timeout: 40_000 })
    // While the next take records, the previous result stays on screen.
    await page.locator('[data-testid="capture-state"][data-state="recording"]').waitFor({ timeout: 20_000 })
    expect(await page.getByTestId('ladder-row').count()).toBe(3)
    await expect.poll(() => strikeCount('C4'), { timeout: 60_000, interval: 500 }).toBeGreaterThanOrEqual(3)
    // The conditions say when they were entered.
    expect(await page.getByTestId('conditions-entered').innerText()).toMatch(/^Entered \d\d:\d\d, (just now|\d+ min ago)$/)
    expect(await page.getByTestId('conditions-stale').count()).toBe(0)
    await screens(page, 'bench-after-1280x800')

    // Turned off, it stays off on this device, and a measured strike leaves the Bench listening.
    await page.getByTestId('stay-armed').uncheck()
    await page.reload()
    await page.getByTestId('bench-note').waitFor()
    expect(await page.getByTestId('stay-armed').isChecked()).toBe(false)
    const before = await strikeCount('C4')
    await page.getByTestId('arm').click()
    await expect.poll(() => strikeCount('C4'), { timeout: 40_000, interval: 500 }).toBeGreaterThan(before)
    await page.locator('[data-testid="capture-state"][data-state="listening"]').waitFor({ timeout: 20_000 })
    await page.close()
  })

  it('brings the result into view after a strike on an 800×1280 portrait screen, with one large capture bar', async () => {
    const page = await session.newPage()
    await openBench(page, portrait.byNote('C4').id, { width: 800, height: 1280 })
    const bar = page.getByTestId('capture-bar')
    expect(await bar.isVisible()).toBe(true)
    // The hand had scrolled down to the cautions: the top of the result area is out of view.
    await page.evaluate(() => window.scrollTo(0, document.documentElement.scrollHeight))
    const area = await page.getByTestId('bench-result-area').boundingBox()
    expect(area!.y).toBeLessThan(-40)
    await page.getByTestId('capture-bar-arm').click()
    const ladder = page.getByTestId('partial-ladder')
    await ladder.waitFor({ timeout: 40_000 })
    const barTop = (await bar.boundingBox())!.y
    await expect.poll(async () => {
      const box = await ladder.boundingBox()
      return box !== null && box.y >= 0 && box.y + box.height <= barTop
    }, { timeout: 5_000 }).toBe(true)
    // The guidance speaks in its own words, never with the sharp/flat triangles.
    expect(await page.getByTestId('guidance-words').first().innerText()).toMatch(/^⊖ remove material: ends$/)
    await page.evaluate(() => window.scrollTo(0, 0))
    await screens(page, 'bench-after-800x1280')
    await page.close()
  })

  it('plays a strike back from the Bench and from the piece page through the audio route', async () => {
    const page = await session.newPage()
    await page.setViewportSize({ width: 1280, height: 800 })
    await signInAs(page, 'bench@tonewright.test')
    // Before a piece is chosen, the cautions are there.
    await page.goto(`${BASE_URL}/bench`)
    const cautions = await page.getByTestId('safety-note').innerText()
    for (const words of [/hearing protection/, /eye protection/, /hot after cutting/, /dust extraction and a mask/, /workshop's and local workplace-safety rules/]) expect(cautions).toMatch(words)
    const pieceId = bench.byNote('C4').id
    await page.goto(`${BASE_URL}/bench?piece=${pieceId}`)
    await page.getByTestId('ladder-row').nth(2).waitFor({ timeout: 20_000 })
    for (const where of ['bench', 'piece'] as const) {
      if (where === 'piece') {
        await page.goto(`${BASE_URL}/pieces/${pieceId}`)
        await page.getByTestId('strike-row').first().waitFor()
      }
      const answer = page.waitForResponse(r => /\/api\/strikes\/[^/]+\/audio\?inline=1$/.test(r.url()))
      await page.getByTestId('strike-play').first().click()
      const response = await answer
      expect([200, 206]).toContain(response.status())
      expect(response.headers()['content-type']).toMatch(/^audio\//)
      const src = await page.getByTestId('strike-audio').first().getAttribute('src')
      expect(src).toMatch(/^\/api\/strikes\/[0-9a-f-]+\/audio\?inline=1$/)
      // The element loaded it: the browser knows the recording's length.
      await expect.poll(() => page.getByTestId('strike-audio').first().evaluate(a => (a as HTMLAudioElement).duration), { timeout: 10_000 }).toBeGreaterThan(1)
    }
    await page.close()
  })
})
