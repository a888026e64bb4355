import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { BASE_URL, launch, screenshot, signInAs } from '../../support/browser'
import { benchStrikeWav } from '../../../support/benchStrike'
import { createBenchSet } from '../../../support/benchSet'

// source: the synthesis itself — a strike of C4 (A4 = 440 Hz) whose fundamental is +10 ¢, the
// second partial 0 ¢ and the third 0 ¢: sharp beyond the fundamental's ±3 ¢ (starter template, common practice).
const CENTS: [number, number, number] = [10, 0, 0]

let session: Awaited<ReturnType<typeof launch>>
let bench: Awaited<ReturnType<typeof createBenchSet>>

beforeAll(async () => {
  bench = await createBenchSet(BASE_URL, 'C4', 'C4')
  const form = new FormData()
  form.set('file', new Blob([benchStrikeWav('C4', { centsByPartial: CENTS, sampleRate: 44100 })], { type: 'audio/wav' }), 'C4.wav')
  const reply = await fetch(`${BASE_URL}/api/pieces/${bench.byNote('C4').id}/strikes`, { method: 'POST', headers: { authorization: `Bearer ${bench.benchToken}` }, body: form })
  if (reply.status !== 201) throw new Error(`strike upload failed: ${reply.status}`)
  session = await launch()
})
afterAll(async () => {
  await session?.close()
})

describe('the cut plan on the Bench', () => {
  it('says no plan exists yet, then draws one from the latest strike with cuts in mm and the partials after it', async () => {
    const page = await session.newPage()
    await signInAs(page, 'bench@tonewright.test')
    await page.goto(`${BASE_URL}/bench?piece=${bench.byNote('C4').id}`)
    await page.getByTestId('cut-plan-none').filter({ hasText: 'No plan exists for the latest strike yet.' }).waitFor({ timeout: 20_000 })
    expect(await page.getByTestId('cut-safety').innerText()).toMatch(/eye and hearing protection[\s\S]*dust extraction[\s\S]*local workplace-safety rules/)
    expect(await page.getByTestId('cut-safety').getAttribute('data-meaning')).toBe('warning')

    await page.getByTestId('cut-plan-make').click()
    const drawing = page.getByTestId('cut-plan-drawing')
    // The drawing, or the server's sentence when it refused: either ends the wait, and the sentence is shown if it failed.
    await page.locator('[data-testid="cut-plan-drawing"], [data-testid="cut-plan"] [role="alert"]').first().waitFor({ timeout: 60_000 })
    expect(await page.getByTestId('cut-plan').locator('[role="alert"]').allInnerTexts()).toEqual([])
    expect(await drawing.locator('path').count()).toBeGreaterThanOrEqual(1)
    // Each cut: position from the left end in mm and depth in mm to 0.05 mm (two decimals).
    const cutRows = await page.getByTestId('cut-plan-cuts').locator('tbody tr').allInnerTexts()
    expect(cutRows.length).toBeGreaterThan(0)
    for (const row of cutRows) expect(row).toMatch(/^\d+\.\d mm\s+\d+\.\d{2} mm$|^No cut\.$/)
    // One row per tuned partial of the triple template (1 : 4 : 10), now → after.
    const predicted = await page.getByTestId('cut-plan-predicted').locator('tbody tr').allInnerTexts()
    expect(predicted).toHaveLength(3)
    expect(predicted[0]).toMatch(/ratio 1\s+\+\d+\.\d ¢\s+→/)
    expect(await page.getByTestId('cut-plan-hand').innerText()).toMatch(/No cut on rosewood bars has been struck after its plan yet/)
    expect(await page.getByTestId('cut-plan-none').count()).toBe(0)
    await screenshot(page, 'bench-cut-plan')
  })
})
