import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { BASE_URL, screenshot, signInAs, useBrowser } from '../../support/browser'
import { ROLES } from '../../support/screens'

const session = useBrowser()

describe('templates', () => {
  it('owner creates a template with a dynamic partial list and edits it into a second version', async () => {
    const page = await session.newPage()
    await signInAs(page, ROLES.owner.email)
    await page.goto(`${BASE_URL}/templates`)
    await page.getByRole('heading', { name: 'Templates', level: 1 }).waitFor()
    await page.getByRole('heading', { name: 'Bell', exact: true }).waitFor()
    await screenshot(page, 'templates-owner')
    await page.getByRole('link', { name: 'New template' }).click()
    const name = `Check chime ${randomUUID().slice(0, 6)}`
    await page.getByLabel('Family').selectOption('tube')
    await page.getByLabel('Template name').fill(name)
    await page.getByRole('button', { name: 'Add a partial' }).click()
    await page.getByLabel('Partial 2 name').fill('second')
    await page.getByLabel('Ratio').nth(1).fill('2.76')
    await page.getByLabel('Tolerance ±¢').nth(1).fill('8')
    await page.getByLabel('Source of the values').fill('Invented for the browser check.')
    await page.getByRole('button', { name: 'Create template' }).click()
    await page.getByRole('heading', { name, level: 1 }).waitFor()
    expect(await page.getByTestId('template-versions').locator('li').count()).toBe(1)
    await page.getByRole('button', { name: /Edit \(makes version 2\)/ }).click()
    await page.getByLabel('Tolerance ±¢').nth(1).fill('6')
    await screenshot(page, 'template-edit')
    await page.getByRole('button', { name: 'Save as a new version' }).click()
    await expect.poll(() => page.getByTestId('template-versions').locator('li').count()).toBe(2)
    expect(await page.getByTestId('template-partials').innerText()).toContain('±6 ¢')
    expect(await page.getByTestId('template-versions').locator('li').last().innerText()).toContain('±8 ¢')
    expect(await page.getByTestId('template-source').innerText()).toContain('Invented for the browser check.')
    await screenshot(page, 'template-page')
    await page.close()
  })

  it('a benchmaker reads templates but gets no edit controls', async () => {
    const page = await session.newPage()
    await signInAs(page, ROLES.benchmaker.email)
    await page.goto(`${BASE_URL}/templates`)
    await page.getByTestId('template-card').first().waitFor()
    expect(await page.getByRole('link', { name: 'New template' }).count()).toBe(0)
    await page.getByTestId('template-card').first().getByRole('link').click()
    await page.getByTestId('template-source').waitFor()
    expect(await page.getByRole('button', { name: /Edit/ }).count()).toBe(0)
    await page.close()
  })
})
