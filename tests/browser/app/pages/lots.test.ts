import { randomInt } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { BASE_URL, screenshot, signInAs, useBrowser, type Page } from '../../support/browser'
import { ROLES, expectText } from '../../support/screens'

const session = useBrowser()

/** The page at the two sizes the issue asks for, landscape desktop and portrait tablet. */
async function screenshotBoth(page: Page, name: string) {
  await screenshot(page, `${name}-1280x800`)
  await page.setViewportSize({ width: 800, height: 1280 })
  await screenshot(page, `${name}-800x1280`)
  await page.setViewportSize({ width: 1280, height: 800 })
}

describe('lots', () => {
  it('office records a rosewood lot (the permit is asked for), sees it listed and opens it', async () => {
    const page = await session.newPage()
    await signInAs(page, ROLES.office.email)
    await page.goto(`${BASE_URL}/`)
    await page.getByRole('navigation').getByRole('link', { name: 'Lots' }).first().click()
    await page.getByRole('heading', { name: 'Lots', level: 1 }).waitFor()
    // The demo workshop's own rosewood lot, with its permit number.
    await expectText(page.getByTestId('lot-row').filter({ hasText: 'RW-2611' }), /MTY-EX-26-0917/)
    await page.getByRole('link', { name: 'New lot' }).click()
    await page.getByRole('heading', { name: 'New lot' }).waitFor()
    const code = `RW-${randomInt(100000, 1000000)}`
    await page.getByLabel('Lot code').fill(code)
    await page.getByLabel('Material', { exact: true }).fill('rosewood')
    await page.getByLabel('Species or alloy').fill('Dalbergia stevensonii')
    await page.getByLabel('Moisture content (%) for wood').fill('9.5')
    await page.getByLabel('Supplier').fill('Brindlecombe Sawmill')
    await page.getByLabel('Received on').fill('2026-11-20')
    await page.getByRole('button', { name: 'Record the lot' }).click()
    // from memory: CITES Appendix II lists Dalbergia spp.; the form asks for the permit beside its field.
    await expectText(page.getByRole('alert').filter({ hasText: 'listed species' }), /Dalbergia is a listed species/)
    expect(page.url()).toMatch(/\/lots\/new$/)
    await page.getByLabel(/Permit or certificate number/).fill('BSM-EX-26-1120')
    await page.getByRole('button', { name: 'Record the lot' }).click()
    await page.waitForURL(/\/lots\/[0-9a-f-]{36}$/)
    await page.getByRole('heading', { name: `Lot ${code}`, level: 1 }).waitFor()
    await expectText(page.getByText('BSM-EX-26-1120'), /BSM-EX-26-1120/)
    await expectText(page.getByText('9.5 %'), /9\.5 %/)
    await screenshotBoth(page, 'lot-page')
    await page.goto(`${BASE_URL}/lots`)
    await expectText(page.getByTestId('lot-row').filter({ hasText: code }), /Brindlecombe Sawmill.*2026-11-20/s)
    await screenshotBoth(page, 'lots')
    await page.getByRole('link', { name: code }).click()
    await page.waitForURL(/\/lots\/[0-9a-f-]{36}$/)
    await page.getByRole('button', { name: 'Edit the lot' }).click()
    await page.getByLabel('Supplier').fill('Brindlecombe Sawmill Co-op')
    await page.getByRole('button', { name: 'Save the lot' }).click()
    await expectText(page.getByText('Brindlecombe Sawmill Co-op'), /Co-op/)
    await page.close()
  })

  it('a piece of the demo marimba links to its lot, and the lot lists the set', async () => {
    const page = await session.newPage()
    await signInAs(page, ROLES.benchmaker.email)
    await page.goto(`${BASE_URL}/pieces?q=${encodeURIComponent('Linden Vale')}`)
    await page.getByTestId('lot-link').first().click()
    await page.waitForURL(/\/lots\/[0-9a-f-]{36}$/)
    await page.getByRole('heading', { name: 'Lot RW-2611', level: 1 }).waitFor()
    await expectText(page.getByTestId('lot-sets'), /Concert marimba for Linden Vale/)
    expect(await page.getByRole('button', { name: 'Edit the lot' }).count()).toBe(0)
    await page.close()
  })
})
