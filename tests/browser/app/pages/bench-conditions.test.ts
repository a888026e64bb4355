import { describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../../../integration/support/http'
import { createSet } from '../../../integration/support/records'
import { BASE_URL, signInAs, useBrowser } from '../../support/browser'
import { expectText } from '../../support/screens'

const session = useBrowser()
// A zone far from the machine's (UTC+14), so a time in the browser's own zone would show.
const ZONE = 'Pacific/Kiritimati'

describe('the Bench\'s conditions in the workshop\'s units', () => {
  it('takes the temperature in °F, keeps it in °C, and tells the entry time in the workshop\'s zone', async () => {
    const owner = await newWorkshop('Fahrenheit bench')
    expect((await api('/api/workshops/current/settings', { method: 'PATCH', token: owner.token, body: { timeZone: ZONE, temperatureUnit: 'F' } })).status).toBe(200)
    const set = await createSet(owner.token, { fromNote: 'C4', toNote: 'C4' })
    const page = await session.newPage()
    await signInAs(page, owner.email, owner.password)
    await page.goto(`${BASE_URL}/bench?piece=${set.pieces[0].id}`)
    const field = page.getByLabel('Temperature (°F)')
    await field.waitFor()
    // The Bench's cautions wear the one warning look: the sign, the safety-yellow colours, the words.
    const safety = page.getByTestId('safety-note')
    expect(await safety.getAttribute('data-meaning')).toBe('warning')
    expect(await safety.locator('svg').first().getAttribute('data-shape')).toBe('warning-sign')
    expect(await safety.getByRole('heading', { name: 'At the bench' }).isVisible()).toBe(true)

    // source: t(°F) = t(°C) × 9/5 + 32: the bench range −10…50 °C is 14…122 °F.
    await field.fill('130')
    await expectText(page.getByTestId('bench-conditions'), /between 14 and 122 °F/)
    // source: common practice: 68 °F is a 20 °C room.
    await field.fill('68')
    await page.getByLabel('Humidity (%)').fill('45')
    await page.getByTestId('conditions-entered').waitFor()
    const remembered = await page.evaluate(() => JSON.parse(localStorage.getItem('tonewright.bench') ?? '{}'))
    expect(remembered.temperatureC).toBeCloseTo(20, 9)
    expect(remembered.humidityPct).toBe(45)
    const clock = (ms: number) => new Intl.DateTimeFormat('en-GB', { timeZone: ZONE, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(ms)
    const entered = await page.getByTestId('conditions-entered').innerText()
    expect(entered.split(',')[0]).toBe(`Entered ${clock(remembered.conditionsEnteredAt)}`)

    // Back on the Bench later, the field shows the kept value in °F again.
    await page.reload()
    await page.getByTestId('conditions-entered').waitFor()
    expect(await page.getByLabel('Temperature (°F)').inputValue()).toBe('68')
    await page.close()
  })
})
