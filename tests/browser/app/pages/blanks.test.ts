import { describe, expect, it } from 'vitest'
import { AUDIO_FORMAT_NAMES } from '../../../../shared/analysis/audioFormats'
import { encodeWav } from '../../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'
import { api, newWorkshop } from '../../../integration/support/http'
import { createSet } from '../../../integration/support/records'
import { BASE_URL, screenshot, signInAs, useBrowser, type Page } from '../../support/browser'
import { expectText } from '../../support/screens'

const { newPage } = useBrowser()

/** Opens a page and waits until Vue has taken it over (a radio or field used before that is not seen by the form). */
async function openHydrated(page: Page, path: string) {
  await page.goto(`${BASE_URL}${path}`)
  await page.waitForFunction(() => Boolean((document.querySelector('#__nuxt') as { __vue_app__?: unknown } | null)?.__vue_app__))
}

// A rosewood-like blank. from memory: dense rosewoods are about 1000 kg/m³ with E near 20 GPa along the grain.
const BLANK = { lengthMm: 420, widthMm: 58, thicknessMm: 24, massG: 584.64 }
const RHO = (BLANK.massG / 1000) / (0.42 * 0.058 * 0.024)
// source: f₁ = (4.7300² / 2π L²) √(E t² / 12 ρ), uniform free–free bar (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1)
const f1For = (eGPa: number) => (4.7300 ** 2 / (2 * Math.PI * 0.42 ** 2)) * Math.sqrt((eGPa * 1e9 * 0.024 ** 2) / (12 * RHO))

describe('blanks', () => {
  it('grades a blank from its figures, shows its grade, the chart of its species and the notes it can make, and turns it into a piece', async () => {
    const owner = await newWorkshop('Hollowmere Bars')
    // An earlier, less stiff rosewood blank (E 18 GPa), so the chart has the new one to stand against.
    const lot = await api('/api/lots', { method: 'POST', token: owner.token, body: { code: 'HV-RW-1', material: 'wood', species: 'rosewood', permitNumber: 'HV-EX-26-0001' } })
    expect(lot.status).toBe(201)
    expect((await api('/api/blanks', { method: 'POST', token: owner.token, body: { ...BLANK, species: 'rosewood', f1Hz: f1For(18), lotId: lot.body.id } })).status).toBe(201)
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'B4' })
    const page = await newPage()
    await signInAs(page, owner.email, owner.password)
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Lots' }).click()
    await page.getByRole('navigation', { name: 'Lots and blanks' }).getByRole('link', { name: 'Blanks' }).click()
    await page.getByRole('heading', { level: 1, name: 'Blanks' }).waitFor()
    await page.getByRole('link', { name: 'Grade a blank' }).click()
    await page.getByRole('heading', { level: 1, name: 'Grade a blank' }).waitFor()

    await page.getByLabel('Species').selectOption('rosewood')
    await page.getByLabel('Length (mm)').fill(String(BLANK.lengthMm))
    await page.getByLabel('Width (mm)').fill(String(BLANK.widthMm))
    await page.getByLabel('Thickness (mm)').fill(String(BLANK.thicknessMm))
    await page.getByLabel('Mass (g)').fill(String(BLANK.massG))
    await page.getByLabel('First mode f₁ (Hz)').fill(f1For(20).toFixed(2))
    await page.getByLabel('Its decay (dB/s, optional)').fill('20')
    await page.getByRole('button', { name: 'Grade and record the blank' }).click()

    const result = page.getByTestId('blank-result')
    // E/ρ ≈ 20 GPa per g/cm³ sits inside the starting rosewood band (usable 17, select 22).
    await expectText(result.getByTestId('blank-rank'), /usable/)
    await expectText(result, /20\.0\d GPa/)
    await expectText(result.getByTestId('blank-thresholds'), /starting thresholds for rosewood/)
    // source: the first free–free mode's nodes lie 0.224 L from each end (Blevins, table 8-1): 94 mm of 420 mm.
    await expectText(result, /22\.4 %.*94 mm/s)
    await expectText(result.getByRole('alert'), /hearing and eye protection/)
    const chart = page.getByTestId('blank-chart')
    await chart.locator('[data-current="true"]').waitFor()
    expect(await chart.locator('g[data-rank]').count()).toBe(2)
    await expectText(chart.getByTestId('blank-chart-summary'), /stiffer per density than 1 of the 1 others/)
    // The blank's own length gives back its own first mode (same formula, the other way).
    await expectText(page.getByTestId('blank-predicted-f1'), new RegExp(f1For(20).toFixed(1).replace('.', '\\.')))
    // source: L = √((4.7300² / 2π f) · √(E t² / 12 ρ)) (Blevins, table 8-1), worked by hand at 24 mm, E 20 GPa, ρ 1000 kg/m³:
    // A4 (440 Hz, ISO 16:1975) needs 500.7 mm, D#5 421.1 mm, E5 409.1 mm; the blank is 420 mm long.
    await page.getByLabel('Range from').selectOption(set.id)
    await expectText(page.getByTestId('blank-notes-summary'), /None of these 3 notes/)
    await page.getByLabel('Range from').selectOption('')
    await page.getByLabel('Lowest note').fill('C5')
    await page.getByLabel('Highest note').fill('C6')
    await expectText(page.getByTestId('blank-notes-summary'), /It can make 9 of these 13 notes: E5 and up/)
    await expectText(page.getByTestId('blank-notes').locator('li[data-fits="false"]').last(), /D#5.*421 mm/)
    await screenshot(page, 'blank-graded')

    await openHydrated(page, '/lots/blanks')
    const row = page.getByTestId('blank-row').first()
    await row.getByRole('button', { name: 'Turn into a piece' }).click()
    await row.getByLabel('Set').selectOption(set.id)
    await row.getByLabel('Piece (at the blank stage)').selectOption((set.pieces[0] as { id: string }).id)
    await row.getByRole('button', { name: 'Make it this piece' }).click()
    await row.getByRole('link', { name: 'the piece' }).waitFor()
    // The lot's page lists the blank graded against it, and offers to grade another from it.
    await openHydrated(page, `/lots/${lot.body.id}`)
    const lotBlanks = page.getByTestId('lot-blanks')
    await expectText(lotBlanks.getByTestId('blank-row'), /Rosewood.*usable/s)
    expect(await lotBlanks.getByTestId('blank-row').count()).toBe(1)
    await lotBlanks.getByRole('link', { name: 'Grade a blank from this lot' }).waitFor()
    await page.close()
  })

  it('the owner sets the workshop\'s own rosewood thresholds, and the next blank is judged by them', async () => {
    const owner = await newWorkshop('Hollowmere Plates')
    const page = await newPage()
    await signInAs(page, owner.email, owner.password)
    await openHydrated(page, '/settings')
    const form = page.getByTestId('settings-blank-thresholds')
    const rosewood = form.locator('fieldset[data-species="rosewood"]')
    await rosewood.getByRole('checkbox').check()
    await rosewood.getByLabel('Select E/ρ at least').fill('26')
    await rosewood.getByLabel('Usable E/ρ at least').fill('27')
    await form.getByRole('button', { name: 'Save blank grades' }).click()
    await expectText(form.getByRole('alert'), /select E\/ρ must be at least the usable/)
    await rosewood.getByLabel('Usable E/ρ at least').fill('21')
    await form.getByRole('button', { name: 'Save blank grades' }).click()
    await expectText(form.getByRole('alert'), /Saved/)
    await screenshot(page, 'settings-blank-thresholds')

    await openHydrated(page, '/lots/blanks/new')
    for (const [label, value] of [['Length (mm)', BLANK.lengthMm], ['Width (mm)', BLANK.widthMm], ['Thickness (mm)', BLANK.thicknessMm], ['Mass (g)', BLANK.massG]] as const) {
      await page.getByLabel(label).fill(String(value))
    }
    await page.getByLabel('First mode f₁ (Hz)').fill(f1For(20).toFixed(2))
    await page.getByRole('button', { name: 'Grade and record the blank' }).click()
    // E/ρ ≈ 20 is below the workshop's usable 21: a reject, by its own figures.
    await expectText(page.getByTestId('blank-rank'), /reject/)
    await expectText(page.getByTestId('blank-thresholds'), /your thresholds for rosewood: select at E\/ρ ≥ 26/)
    await page.close()
  })

  it('grades a blank from an uploaded recording of its strike: E within 0.5 % of the one it was made with', async () => {
    const owner = await newWorkshop('Hollowmere Strikes')
    // A decaying sinusoid at the first mode E = 20 GPa gives, 25 dB/s: a synthetic strike of a known blank.
    const wav = encodeWav(synthStrike([{ frequencyHz: f1For(20), amplitudeDb: -8, decayDbPerS: 25 }], { sampleRate: 48000, durationS: 2, onsetS: 0.05, noiseDb: -80, seed: 5 }), 48000)
    const page = await newPage()
    await signInAs(page, owner.email, owner.password)
    await openHydrated(page, '/lots/blanks/new')
    for (const [label, value] of [['Length (mm)', BLANK.lengthMm], ['Width (mm)', BLANK.widthMm], ['Thickness (mm)', BLANK.thicknessMm], ['Mass (g)', BLANK.massG]] as const) {
      await page.getByLabel(label).fill(String(value))
    }
    await page.getByLabel('From a recording of its strike').check()
    await page.getByLabel(`Or a recording (${AUDIO_FORMAT_NAMES})`).setInputFiles({ name: 'blank.wav', mimeType: 'audio/wav', buffer: Buffer.from(wav) })
    await page.getByRole('button', { name: 'Grade and record the blank' }).click()
    const modulus = page.getByTestId('blank-result').locator('div', { hasText: 'Young\'s modulus E (Euler–Bernoulli)' }).locator('dd')
    await modulus.waitFor({ timeout: 90_000 })
    const eGPa = Number((await modulus.innerText()).replace(/[^\d.]/g, ''))
    expect(Math.abs(eGPa / 20 - 1)).toBeLessThan(0.005)
    await page.close()
  })
})
