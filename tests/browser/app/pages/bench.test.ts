import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { BASE_URL, launch, screenshot, signInAs, type Page } from '../../support/browser'
import { benchStrikeWav } from '../../../support/benchStrike'
import { synthStrike } from '../../../support/synthStrike'
import { writeWav } from '../../../support/writeWav'
import { noteToFrequencyHz } from '../../../../shared/analysis/noteToFrequencyHz'
import { createBenchSet, pieceOf } from '../../../support/benchSet'

// source: the synthesis itself — the fake microphone plays a strike of C4 (A4 = 440 Hz)
// whose fundamental is tuned +3.0 ¢, second partial 0.0 ¢ and third −14.0 ¢ from the targets.
const TRUTH = { fundamental: 3.0, second: 0.0, third: -14.0 }

let session: Awaited<ReturnType<typeof launch>>
let bench: Awaited<ReturnType<typeof createBenchSet>>
const dir = mkdtempSync(join(tmpdir(), 'tw-bench-'))

beforeAll(async () => {
  bench = await createBenchSet(BASE_URL)
  const micFile = join(dir, 'fake-mic-C4.wav')
  writeFileSync(micFile, benchStrikeWav('C4', { centsByPartial: [TRUTH.fundamental, TRUTH.second, TRUTH.third], sampleRate: 44100 }))
  session = await launch(['--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream', `--use-file-for-fake-audio-capture=${micFile}`])
})
afterAll(async () => {
  await session?.close()
})

const centsOf = (text: string) => Number(text.replace('−', '-').replace('±', '').replace(/[^\d.+-]/g, ''))

async function openBench(page: Page, note: string) {
  await signInAs(page, 'bench@tonewright.test')
  await page.goto(`${BASE_URL}/bench?piece=${bench.byNote(note).id}`)
  await page.getByTestId('bench-note').filter({ hasText: note }).waitFor()
}

/** Drops files on the drop zone as a drag from the desktop would. */
async function dropFiles(page: Page, files: { name: string, bytes: Uint8Array }[]) {
  const payload = files.map(f => ({ name: f.name, data: Buffer.from(f.bytes).toString('base64') }))
  const transfer = await page.evaluateHandle((list) => {
    const dt = new DataTransfer()
    for (const f of list) {
      const bin = atob(f.data)
      const bytes = new Uint8Array(bin.length)
      for (let i = 0; i < bin.length; i++) bytes[i] = bin.charCodeAt(i)
      dt.items.add(new File([bytes], f.name, { type: f.name.endsWith('.wav') ? 'audio/wav' : 'application/octet-stream' }))
    }
    return dt
  }, payload)
  await page.getByTestId('drop-zone').dispatchEvent('dragover', { dataTransfer: transfer })
  await page.getByTestId('drop-zone').dispatchEvent('drop', { dataTransfer: transfer })
}

describe('the Bench', () => {
  it('measures a strike from the microphone and shows the ladder within 0.5 ¢ of the truth', async () => {
    const page = await session.newPage()
    await openBench(page, 'C4')
    // 20 °C is the template's reference temperature, so the cents are not shifted by it.
    await page.getByLabel('Temperature (°C)').fill('20')
    await page.getByLabel('Humidity (%)').fill('45')
    // One take only here (the stay-armed loop has its own test).
    await page.getByTestId('stay-armed').uncheck()
    await page.getByTestId('arm').click()
    await page.getByTestId('ladder-row').nth(2).waitFor({ timeout: 40_000 })
    // One row per template partial of the marimba triple template (1 : 4 : 10).
    expect(await page.getByTestId('ladder-row').count()).toBe(3)
    const cents = (await page.getByTestId('ladder-cents').allInnerTexts()).map(centsOf)
    expect(Math.abs(cents[0]! - TRUTH.fundamental)).toBeLessThanOrEqual(0.5)
    expect(Math.abs(cents[1]! - TRUTH.second)).toBeLessThanOrEqual(0.5)
    expect(Math.abs(cents[2]! - TRUTH.third)).toBeLessThanOrEqual(0.5)
    expect(await page.getByTestId('ladder-row').nth(2).getAttribute('data-state')).toBe('flat')
    // The third is flat beyond its ±10 ¢: guidance says raise, where to thin, and who decides.
    const guidance = await page.getByTestId('guidance').innerText()
    expect(guidance).toMatch(/Raise the third \(triple octave and major third\) by 14\.\d ¢: thin within the outer/)
    expect(guidance).toMatch(/Rayleigh-quotient/)
    expect(guidance).toMatch(/benchmaker's judgement rules/)
    await page.getByTestId('spectrum-chart').locator('canvas').waitFor()
    await page.getByTestId('decay-chart').locator('canvas').waitFor()
    expect(await page.getByText('Rough pitch (browser, a guide only)').isVisible()).toBe(true)
    // The Bench's own cautions (the cut plan panel repeats some of them in its own note).
    const safety = page.getByTestId('safety-note').first()
    expect(await safety.getByText(/hearing protection/).first().isVisible()).toBe(true)
    expect(await safety.getByText(/local workplace-safety rules/).isVisible()).toBe(true)
    const stored = await pieceOf(BASE_URL, bench.token, bench.byNote('C4').id)
    expect(stored.strikeCount).toBe(1)
    expect(stored.strikes[0]).toMatchObject({ temperatureC: 20, humidityPct: 45 })
    await page.getByTestId('capture-state').filter({ hasText: 'Listening' }).waitFor()
    await screenshot(page, 'bench-desktop')

    await page.setViewportSize({ width: 1194, height: 834 })
    await page.waitForTimeout(300)
    await screenshot(page, 'bench-tablet')
    // Touch targets: every button and link on the Bench is at least 44 px tall.
    const small = await page.locator('main button:visible, main a:visible').evaluateAll(els => els
      .map(e => ({ text: (e as HTMLElement).innerText.trim(), h: e.getBoundingClientRect().height }))
      .filter(b => b.h < 44))
    expect(small).toEqual([])
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
    expect(overflow).toBeLessThanOrEqual(0)

    // The conditions are remembered across a reload; the keys send to review and move on.
    await page.reload()
    await page.getByTestId('ladder-row').nth(2).waitFor()
    expect(await page.getByLabel('Temperature (°C)').inputValue()).toBe('20')
    await page.getByRole('heading', { level: 1 }).click()
    await page.keyboard.press('r')
    await page.getByText('C4 is in review.').waitFor()
    expect((await pieceOf(BASE_URL, bench.token, bench.byNote('C4').id)).stage).toBe('review')
    await page.keyboard.press('n')
    await page.waitForURL(url => url.searchParams.get('piece') === bench.byNote('C#4').id)
    await page.getByTestId('bench-note').filter({ hasText: 'C#4' }).waitFor()
    await page.close()
  })

  it('maps three dropped files to their pieces by the note in the name and measures each', async () => {
    const page = await session.newPage()
    // This time through the picker: set first, then the piece.
    await signInAs(page, 'bench@tonewright.test')
    await page.goto(`${BASE_URL}/bench`)
    await page.getByRole('button', { name: new RegExp(bench.serial) }).click()
    await page.getByTestId('pick-piece').nth(4).waitFor()
    await screenshot(page, 'bench-picker')
    await page.locator('[data-testid="pick-piece"][data-note="E4"]').click()
    await page.waitForURL(url => url.searchParams.get('piece') === bench.byNote('E4').id)
    await page.getByTestId('bench-note').filter({ hasText: 'E4' }).waitFor()
    await dropFiles(page, [
      { name: 'C4.wav', bytes: benchStrikeWav('C4', { centsByPartial: [1, 0, 0], seed: 2 }) },
      { name: 'C#4-second-try.wav', bytes: benchStrikeWav('C#4', { centsByPartial: [-6, 2, 0], seed: 3 }) },
      { name: 'Eb4_take2.wav', bytes: benchStrikeWav('D#4', { centsByPartial: [0, 0, 0], seed: 4 }) },
    ])
    const rows = page.getByTestId('upload-row')
    await rows.nth(2).waitFor()
    expect(await page.getByTestId('upload-piece').allInnerTexts()).toEqual(['C4', 'C#4', 'D#4'])
    await screenshot(page, 'bench-upload-mapping')
    const before = await Promise.all(['C4', 'C#4', 'D#4'].map(n => pieceOf(BASE_URL, bench.token, bench.byNote(n).id)))
    await page.getByTestId('upload-send').click()
    await page.getByTestId('upload-row').filter({ hasText: 'measured' }).nth(2).waitFor({ timeout: 40_000 })
    const after = await Promise.all(['C4', 'C#4', 'D#4'].map(n => pieceOf(BASE_URL, bench.token, bench.byNote(n).id)))
    after.forEach((p, i) => expect(p.strikeCount).toBe(before[i]!.strikeCount + 1))
    await page.close()
  })

  it('shows what to do about a troubled recording and folds the notes on the measurement under one line', async () => {
    // A D4 strike with several things to say: driven into clipping, a DC offset, a second blow,
    // and its second channel wired the other way round.
    const f = noteToFrequencyHz('D4')
    const bar = [{ frequencyHz: f, amplitudeDb: -8, decayDbPerS: 12 }, { frequencyHz: 4 * f, amplitudeDb: -18, decayDbPerS: 22 }]
    const first = synthStrike(bar, { sampleRate: 48000, durationS: 3, onsetS: 0.3, noiseDb: -78, seed: 5 })
    const second = synthStrike(bar, { sampleRate: 48000, durationS: 3, onsetS: 2.2, seed: 6 })
    const left = first.map((v, i) => Math.max(-1, Math.min(1, 3 * (v + 0.5 * second[i]!) + 0.05)))
    const form = new FormData()
    form.append('file', new Blob([writeWav([left, left.map(v => -v)], 48000, 'pcm16')]), 'D4.wav')
    const posted = await fetch(`${BASE_URL}/api/pieces/${bench.byNote('D4').id}/strikes`, { method: 'POST', headers: { authorization: `Bearer ${bench.benchToken}` }, body: form })
    expect(posted.status).toBe(201)
    const { warnings, advice } = ((await posted.json()) as { analysis: { warnings: string[], advice: string[] } }).analysis
    expect(advice.some(w => w.includes('opposite polarity'))).toBe(true)
    expect(advice.some(w => w.startsWith('clipped samples'))).toBe(true)
    const rest = warnings.filter(w => !advice.includes(w))
    expect(rest.length).toBeGreaterThan(0)

    const page = await session.newPage()
    await openBench(page, 'D4')
    // What to do about the recording is in view at once.
    const polarity = page.getByRole('alert').filter({ hasText: 'opposite polarity' })
    await polarity.waitFor()
    expect(await page.getByTestId('reading-advice').getByRole('alert').count()).toBe(advice.length)
    // How the measurement went folds under one line, opened on request.
    const summary = page.getByTestId('reading-notes-summary')
    expect((await summary.innerText()).trim()).toBe(`${rest.length} more note${rest.length === 1 ? '' : 's'} on how this reading was measured`)
    const technical = page.getByTestId('reading-notes').getByRole('alert').first()
    expect(await technical.isVisible()).toBe(false)
    await summary.click()
    await technical.waitFor()
    expect(await page.getByTestId('reading-notes').getByRole('alert').count()).toBe(rest.length)
    await screenshot(page, 'bench-reading-notes')
    await page.close()
  })

  it('shows the engine\'s sentence next to a bad file and saves nothing for it', async () => {
    const page = await session.newPage()
    await openBench(page, 'E4')
    const bad = new TextEncoder().encode('These are workshop notes, not a recording.\n'.repeat(20))
    // The engine's own answer for these bytes, asked directly.
    const form = new FormData()
    form.append('file', new Blob([bad]), 'E4.wav')
    const direct = await fetch(`${BASE_URL}/api/pieces/${bench.byNote('E4').id}/strikes`, { method: 'POST', headers: { authorization: `Bearer ${bench.benchToken}` }, body: form })
    expect([413, 415, 422]).toContain(direct.status)
    const sentence = ((await direct.json()) as { message: string }).message
    expect(sentence.length).toBeGreaterThan(10)

    await dropFiles(page, [{ name: 'E4.wav', bytes: bad }])
    await page.getByTestId('upload-send').click()
    const problem = page.getByTestId('upload-problem')
    await problem.waitFor()
    expect(await problem.innerText()).toBe(sentence)
    const stored = await pieceOf(BASE_URL, bench.token, bench.byNote('E4').id)
    expect(stored.strikeCount).toBe(0)
    expect(stored.strikes).toEqual([])
    await screenshot(page, 'bench-bad-file')
    await page.close()
  })
})
