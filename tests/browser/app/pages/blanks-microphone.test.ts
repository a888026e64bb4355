import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { newWorkshop } from '../../../integration/support/http'
import { synthStrike } from '../../../support/synthStrike'
import { writeWav } from '../../../support/writeWav'
import { BASE_URL, launch, signInAs } from '../../support/browser'

// A rosewood-like blank. from memory: dense rosewoods are about 1000 kg/m³ with E near 20 GPa along the grain.
const BLANK = { lengthMm: 420, widthMm: 58, thicknessMm: 24, massG: 584.64 }
const RHO = (BLANK.massG / 1000) / (0.42 * 0.058 * 0.024)
// source: f₁ = (4.7300² / 2π L²) √(E t² / 12 ρ), uniform free–free bar (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1)
const F1 = (4.7300 ** 2 / (2 * Math.PI * 0.42 ** 2)) * Math.sqrt((20e9 * 0.024 ** 2) / (12 * RHO))

let session: Awaited<ReturnType<typeof launch>>
beforeAll(async () => {
  // The fake microphone plays a quiet lead-in, then the blank's first mode (E = 20 GPa) ringing down at 25 dB/s.
  const micFile = join(mkdtempSync(join(tmpdir(), 'tw-blank-')), 'fake-mic-blank.wav')
  const samples = synthStrike([{ frequencyHz: F1, amplitudeDb: -8, decayDbPerS: 25 }], { sampleRate: 44100, durationS: 4, onsetS: 0.6, noiseDb: -78, seed: 7 })
  writeFileSync(micFile, writeWav([samples], 44100, 'pcm16'))
  session = await launch(['--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream', `--use-file-for-fake-audio-capture=${micFile}`])
})
afterAll(async () => {
  await session?.close()
})

describe('blanks on the microphone', () => {
  it('records the blank\'s strike on the bench microphone and grades it: E within 0.5 %', async () => {
    const owner = await newWorkshop('Hollowmere Microphone')
    const page = await session.newPage()
    await signInAs(page, owner.email, owner.password)
    await page.goto(`${BASE_URL}/lots/blanks/new`)
    await page.waitForFunction(() => Boolean((document.querySelector('#__nuxt') as { __vue_app__?: unknown } | null)?.__vue_app__))
    for (const [label, value] of [['Length (mm)', BLANK.lengthMm], ['Width (mm)', BLANK.widthMm], ['Thickness (mm)', BLANK.thicknessMm], ['Mass (g)', BLANK.massG]] as const) {
      await page.getByLabel(label).fill(String(value))
    }
    await page.getByLabel('From a recording of its strike').check()
    await page.getByRole('button', { name: 'Record its strike' }).click()
    await page.getByTestId('blank-recorder-state').filter({ hasText: 'ready to grade' }).waitFor({ timeout: 60_000 })
    await page.getByRole('button', { name: 'Grade and record the blank' }).click()
    const modulus = page.getByTestId('blank-result').locator('div', { hasText: 'Young\'s modulus E (Euler–Bernoulli)' }).locator('dd')
    await modulus.waitFor({ timeout: 90_000 })
    const eGPa = Number((await modulus.innerText()).replace(/[^\d.]/g, ''))
    expect(Math.abs(eGPa / 20 - 1)).toBeLessThan(0.005)
    await page.close()
  })
})
