import { describe, expect, it } from 'vitest'
import { BASE_URL, screenshot, signInAs, useBrowser } from '../../support/browser'

const session = useBrowser()

describe('signing in', () => {
  it('sends a visitor to the sign-in page', async () => {
    const page = await session.newPage()
    await page.goto(`${BASE_URL}/team`)
    await page.waitForURL(/\/signin/)
    expect(await page.getByRole('heading', { name: 'Sign in' }).isVisible()).toBe(true)
    await page.close()
  })

  it('shows a plain message for a wrong password, next to the form', async () => {
    const page = await session.newPage()
    await page.goto(`${BASE_URL}/signin`)
    await page.getByLabel('E-mail').fill('owner@tonewright.test')
    await page.getByLabel('Password').fill('wrong-password')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expectText(page.getByRole('alert'), /do not match an account/)
    await page.close()
  })

  it('signs the demo owner in to the dashboard and the Team screen', async () => {
    const page = await session.newPage()
    await signInAs(page, 'owner@tonewright.test')
    await page.getByRole('heading', { name: 'Brackenfold Bar & Bell Works' }).waitFor()
    const nav = await page.getByRole('navigation', { name: 'Main' }).innerText()
    for (const label of ['Bench', 'Pieces', 'Sets', 'Review', 'Templates', 'Certificates', 'Team']) expect(nav).toContain(label)
    await screenshot(page, 'dashboard-owner')
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Team' }).click()
    await page.getByRole('heading', { name: 'Team' }).waitFor()
    await page.getByTestId('team-row').nth(3).waitFor()
    expect(await page.getByTestId('team-row').count()).toBe(4)
    expect(await page.getByRole('heading', { name: 'Add a member' }).isVisible()).toBe(true)
    await screenshot(page, 'team-owner')
    await page.close()
  })

  it('lets the owner add a member with a role from the Team screen', async () => {
    const page = await session.newPage()
    await signInAs(page, 'owner@tonewright.test')
    await page.goto(`${BASE_URL}/team`)
    const form = page.locator('form', { has: page.getByRole('heading', { name: 'Add a member' }) })
    const email = `new-office-${Date.now()}@example.test`
    await form.getByLabel('Name').fill('Wren Ashby')
    await form.getByLabel('E-mail').fill(email)
    await form.getByLabel('Role').selectOption('office')
    await form.getByLabel('Temporary password').fill('temporary-pass-456')
    await form.getByRole('button', { name: 'Add member' }).click()
    const row = page.getByTestId('team-row').filter({ hasText: email })
    await row.waitFor()
    expect(await row.getByRole('combobox').inputValue()).toBe('office')
    await page.close()
  })

  it('hides owner-only controls and screens from a benchmaker', async () => {
    const page = await session.newPage()
    await signInAs(page, 'bench@tonewright.test')
    const nav = await page.getByRole('navigation', { name: 'Main' }).innerText()
    expect(nav).not.toContain('Review')
    expect(nav).not.toContain('Certificates')
    await page.goto(`${BASE_URL}/review`)
    await page.waitForURL(/denied=/)
    await page.goto(`${BASE_URL}/team`)
    await page.getByTestId('team-row').first().waitFor()
    expect(await page.getByRole('heading', { name: 'Add a member' }).count()).toBe(0)
    await page.close()
  })
})

async function expectText(locator: import('playwright-core').Locator, pattern: RegExp) {
  await locator.first().waitFor()
  expect(await locator.first().innerText()).toMatch(pattern)
}
