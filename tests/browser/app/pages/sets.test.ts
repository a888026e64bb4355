import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { BASE_URL, screenshot, signInAs, useBrowser } from '../../support/browser'
import { ROLES, expectText } from '../../support/screens'

const session = useBrowser()

describe('sets', () => {
  it('office creates a set through the form, with a live count of the pieces the range makes', async () => {
    const page = await session.newPage()
    await signInAs(page, ROLES.office.email)
    await page.goto(`${BASE_URL}/sets/new`)
    await page.getByRole('heading', { name: 'New set' }).waitFor()
    const name = `Concert marimba ${randomUUID().slice(0, 6)}`
    await page.getByLabel('Set name').fill(name)
    await page.getByLabel('Model').fill('Fieldfare 4.3')
    await page.getByLabel('Serial number').fill(`FF-${randomUUID().slice(0, 8)}`)
    await page.getByLabel('Buyer\'s name').fill('Rowan Leckie')
    await page.getByLabel('Organisation (optional)').fill('Eastmere Youth Percussion')
    await page.getByLabel('Buyer\'s e-mail').fill('rowan@example.test')
    await page.getByLabel('From note').fill('A2')
    await page.getByLabel('To note').fill('C7')
    // common practice: a 4.3-octave marimba, A2 to C7 chromatic, is one set of 52 bars
    await expectText(page.getByTestId('range-preview'), /^52 pieces/)
    await page.getByLabel('Chromatic (with accidentals)').uncheck()
    // common practice: naturals only from A2 to C7 are A2, B2, four octaves of seven, and C7: 2 + 28 + 1 = 31
    await expectText(page.getByTestId('range-preview'), /^31 pieces/)
    await page.getByLabel('Chromatic (with accidentals)').check()
    await page.getByLabel('To note').fill('C2')
    await expectText(page.getByTestId('range-preview'), /runs backwards/)
    await page.getByLabel('To note').fill('C7')
    await page.getByLabel('Ratio template').selectOption({ label: 'Marimba bar, triple (1 : 4 : 10) (v1)' })
    await screenshot(page, 'set-new-office')
    await page.getByRole('button', { name: 'Create set and its pieces' }).click()
    await page.waitForURL(/\/sets\/[0-9a-f-]{36}$/)
    await page.getByRole('heading', { name, level: 1 }).waitFor()
    await page.getByTestId('set-cell').nth(51).waitFor()
    expect(await page.getByTestId('set-cell').count()).toBe(52)
    expect(await page.getByTestId('set-cell').first().innerText()).toContain('A2')
    expect(await page.getByTestId('set-cell').last().innerText()).toContain('C7')
    expect(await page.getByRole('button', { name: 'Mark shipped' }).isDisabled()).toBe(true)
    await screenshot(page, 'set-page-new')
    await page.goto(`${BASE_URL}/sets`)
    await page.getByRole('link', { name }).waitFor()
    await screenshot(page, 'sets-office')
    await page.goto(`${BASE_URL}/pieces?q=${encodeURIComponent(name)}`)
    await expectText(page.getByTestId('pieces-count'), /of 52 pieces · page 1 of 3/)
    await page.getByRole('button', { name: 'Next →' }).click()
    await page.waitForURL(url => url.searchParams.get('page') === '2')
    await expectText(page.getByTestId('pieces-count'), /^26–50 of 52/)
    await page.close()
  })

  it('refuses an empty form with plain sentences beside the fields', async () => {
    const page = await session.newPage()
    await signInAs(page, ROLES.office.email)
    await page.goto(`${BASE_URL}/sets/new`)
    await page.getByRole('button', { name: 'Create set and its pieces' }).click()
    await expectText(page.getByRole('alert').filter({ hasText: 'Name the set' }), /Name the set/)
    await expectText(page.getByRole('alert').filter({ hasText: 'template' }), /Choose a template/)
    expect(page.url()).toMatch(/\/sets\/new$/)
    await page.close()
  })
})
