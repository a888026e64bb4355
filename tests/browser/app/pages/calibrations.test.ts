import postgres from 'postgres'
import { afterAll, describe, expect, it } from 'vitest'
import { encodeWav } from '../../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'
import { api, memberWithRole, newWorkshop } from '../../../integration/support/http'
import { createSet, strikeWav } from '../../../integration/support/records'
import { BASE_URL, screenshot, signInAs, useBrowser } from '../../support/browser'

const { newPage } = useBrowser()
const sql = postgres(process.env.NUXT_DATABASE_URL!, { max: 1, onnotice: () => {} })
afterAll(() => sql.end())

/** A 1000 Hz reference tone as an input reading `ppm` high records it (6 s, 48 kHz, SNR ≈ 31 dB). */
const tone = (ppm: number) => encodeWav(synthStrike([{ frequencyHz: 1000 * (1 + ppm * 1e-6), amplitudeDb: -6, decayDbPerS: 0 }], { sampleRate: 48000, durationS: 6, noiseDb: -40, seed: 5 }), 48000)

describe('input calibrations', () => {
  it('the owner sees each input\'s offset, expiry and drift under Settings, and records a new reference tone', async () => {
    const owner = await newWorkshop('Lowmarsh Bells')
    // Two older calibrations of the same input, so the drift chart has history.
    await sql`insert into calibrations (workshop_id, device, reference_hz, reference_uncertainty_ppm, measured_hz, offset_ppm, uncertainty_ppm, operator_id, created_at)
      values (${owner.workshopId}, 'Desk interface', 1000, 0.4, 1000.0451, 45.1, 0.42, ${owner.userId}, now() - interval '120 days'),
             (${owner.workshopId}, 'Desk interface', 1000, 0.4, 1000.0438, 43.8, 0.41, ${owner.userId}, now() - interval '40 days')`
    const page = await newPage()
    await signInAs(page, owner.email, owner.password)
    await page.goto(`${BASE_URL}/settings`)
    await page.getByTestId('settings-calibrations-link').click()
    await page.getByRole('heading', { level: 1, name: 'Input calibrations' }).waitFor()
    const card = page.getByTestId('calibration-device').filter({ hasText: 'Desk interface' })
    await expect.poll(() => card.getByTestId('calibration-offset').innerText()).toMatch(/^\+43\.8 ± 0\.4 ppm/)
    expect(await card.getByTestId('calibration-status').innerText()).toMatch(/valid, expires in 4[89] days/)
    expect(await card.getByTestId('calibration-status').getAttribute('data-meaning')).toBe('valid')
    // The drift chart says in words what it draws: 45.1 → 43.8 ppm over 80 days.
    expect(await card.getByTestId('calibration-drift').locator('figcaption').innerText()).toMatch(/From \+45\.1 to \+43\.8 ppm over 80 days: −1\.3 ppm/)
    expect(await card.locator('svg[role="img"]').getAttribute('aria-label')).toMatch(/Clock offset of Desk interface/)
    // A new input, measured from an uploaded tone through the form.
    const form = page.getByTestId('calibration-form')
    await form.getByTestId('calibration-device-name').fill('Field recorder')
    await form.getByTestId('calibration-file').setInputFiles({ name: 'reference.wav', mimeType: 'audio/wav', buffer: Buffer.from(tone(300)) })
    await form.getByRole('button', { name: 'Measure and keep' }).click()
    await form.getByRole('alert').filter({ hasText: /reads \+(299|300)\.\d ± \d\.\d+ ppm/ }).waitFor({ timeout: 90_000 })
    const recorder = page.getByTestId('calibration-device').filter({ hasText: 'Field recorder' })
    await recorder.waitFor()
    await screenshot(page, 'calibrations')
    const list = await api('/api/calibrations', { token: owner.token })
    expect(list.body.devices.map((d: { device: string }) => d.device).sort()).toEqual(['Desk interface', 'Field recorder'])
  })

  it('the Bench shows the chosen input\'s calibration, warns when it has none or it has expired, and sends its id', async () => {
    const owner = await newWorkshop('Lowmarsh Bars')
    // A benchmaker: the calibrations screen under Settings is theirs too.
    const bench = await memberWithRole(owner.token, 'benchmaker')
    await sql`insert into calibrations (workshop_id, device, reference_hz, reference_uncertainty_ppm, measured_hz, offset_ppm, uncertainty_ppm, created_at)
      values (${owner.workshopId}, 'Desk interface', 1000, 0.4, 1000.0413, 41.3, 0.42, now() - interval '2 days'),
             (${owner.workshopId}, 'Old recorder', 1000, 0.4, 999.9826, -17.4, 0.41, now() - interval '93 days')`
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const page = await newPage()
    await signInAs(page, bench.email, bench.password)
    await page.goto(`${BASE_URL}/bench?piece=${set.pieces[0].id}`)
    const line = page.getByTestId('bench-calibration-line')
    await expect.poll(() => line.innerText()).toMatch(/^No calibration for this input/)
    expect(await line.getAttribute('data-meaning')).toBe('warning')
    await page.getByTestId('bench-calibration-device').selectOption('Desk interface')
    await expect.poll(() => line.innerText()).toMatch(/^Input calibrated .+, \+41\.3 ± 0\.4 ppm$/)
    expect(await line.getAttribute('data-meaning')).toBe('valid')
    await screenshot(page, 'bench-calibration')
    // A recording sent from the Bench carries the chosen input's calibration.
    await page.getByTestId('drop-zone').locator('input[type="file"]').setInputFiles({ name: 'A4.wav', mimeType: 'audio/wav', buffer: Buffer.from(strikeWav(440, [1, 4], [0, 0])) })
    await page.getByTestId('upload-send').click()
    await expect.poll(async () => (await sql`select c.device from strikes s join calibrations c on c.id = s.calibration_id where s.piece_id = ${set.pieces[0].id}`).map(r => r.device), { timeout: 90_000 }).toEqual(['Desk interface'])
    // Remembered in this browser: a reload keeps the choice.
    await page.reload()
    await expect.poll(() => page.getByTestId('bench-calibration-line').innerText()).toMatch(/\+41\.3 ± 0\.4 ppm/)
    await page.getByTestId('bench-calibration-device').selectOption('Old recorder')
    await expect.poll(() => page.getByTestId('bench-calibration-line').innerText()).toBe('Calibration expired 3 days ago — record a reference tone.')
    expect(await page.getByTestId('bench-calibration-line').getAttribute('data-meaning')).toBe('warning')
    await page.getByTestId('bench-calibrations-link').click()
    await page.getByRole('heading', { level: 1, name: 'Input calibrations' }).waitFor()
  })

  it('the demo workshop\'s inputs show their drift, and the expired one says so', async () => {
    const page = await newPage()
    await signInAs(page, 'bench@tonewright.test')
    await page.goto(`${BASE_URL}/settings/calibrations`)
    const bench = page.getByTestId('calibration-device').filter({ hasText: 'Bench 1 audio interface, input 1' })
    // The seed made the tones at +42.2, +41.9, +41.6 and +41.3 ppm over 175 days (demo-calibrations.ts).
    await expect.poll(() => bench.getByTestId('calibration-drift').locator('figcaption').innerText()).toMatch(/From \+42\.2 to \+41\.3 ppm over 175 days/)
    const field = page.getByTestId('calibration-device').filter({ hasText: 'Field recorder for site visits' })
    expect(await field.getByTestId('calibration-status').innerText()).toMatch(/expired 14 days ago/)
    expect(await field.getByTestId('calibration-status').getAttribute('data-meaning')).toBe('warning')
    await screenshot(page, 'calibrations-demo')
  })
})
