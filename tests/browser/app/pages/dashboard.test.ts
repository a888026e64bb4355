import { describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../../../integration/support/http'
import { BASE_URL, signInAs, untilHydrated, useBrowser } from '../../support/browser'
import { expectText } from '../../support/screens'

const session = useBrowser()
const ZONE = 'Pacific/Kiritimati'

/** Monday of this week where the workshop is, as the dashboard writes it ("30 Nov"); ISO 8601 weeks start on Monday. */
function mondayIn(timeZone: string, now = Date.now()): string {
  const parts = Object.fromEntries(new Intl.DateTimeFormat('en-US', { timeZone, year: 'numeric', month: 'numeric', day: 'numeric', weekday: 'short' })
    .formatToParts(now).map(p => [p.type, p.value]))
  const sinceMonday = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'].indexOf(parts.weekday!)
  const monday = new Date(Date.UTC(Number(parts.year), Number(parts.month) - 1, Number(parts.day) - sinceMonday))
  return monday.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' })
}

describe('the dashboard', () => {
  it('writes the start of "this week" as the workshop\'s Monday', async () => {
    const owner = await newWorkshop('Week overview')
    expect((await api('/api/workshops/current/settings', { method: 'PATCH', token: owner.token, body: { timeZone: ZONE } })).status).toBe(200)
    const page = await session.newPage()
    await signInAs(page, owner.email, owner.password)
    await page.goto(`${BASE_URL}/`)
    await untilHydrated(page)
    const before = mondayIn(ZONE)
    const text = await page.getByTestId('week-of').innerText()
    // Around midnight the week may turn between the two readings: either Monday is right then.
    expect([`(since Mon ${before})`, `(since Mon ${mondayIn(ZONE)})`]).toContain(text)
    await expectText(page.getByTestId('dashboard'), /Strikes this week/)
    await page.close()
  })
})
