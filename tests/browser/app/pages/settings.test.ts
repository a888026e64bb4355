import { describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../../../integration/support/http'
import { createSet } from '../../../integration/support/records'
import { BASE_URL, screenshot, signInAs, useBrowser } from '../../support/browser'

const { newPage } = useBrowser()

describe('workshop settings and confirmations', () => {
  it('the owner sets the workshop\'s time zone, and the user menu leads to Change password', async () => {
    const owner = await newWorkshop('Quillbrook Chimes')
    const page = await newPage()
    await signInAs(page, owner.email, owner.password)
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Settings' }).click()
    await page.getByRole('heading', { level: 1, name: 'Workshop settings' }).waitFor()
    await page.getByLabel('Time zone (IANA name)').fill('Mars/Olympus_Mons')
    await page.getByRole('button', { name: 'Save settings' }).click()
    await page.getByRole('alert').filter({ hasText: 'not a time zone name' }).waitFor()
    await page.getByLabel('Time zone (IANA name)').fill('Asia/Tokyo')
    await page.getByRole('button', { name: 'Save settings' }).click()
    await page.getByRole('alert').filter({ hasText: 'Saved' }).waitFor()
    // source: IANA tz database (Asia/Tokyo): JST, +09:00 all year.
    await expect.poll(() => page.getByTestId('settings-preview').innerText()).toMatch(/GMT\+9|JST/)
    await screenshot(page, 'settings-owner')
    expect((await api('/api/workshops/current/settings', { token: owner.token })).body.timeZone).toBe('Asia/Tokyo')
    await page.getByTestId('user-menu').locator('summary').click()
    await page.getByRole('link', { name: 'Change password' }).click()
    await page.getByRole('heading', { name: 'Change your password' }).waitFor()
  })

  it('scrapping a piece asks first, needs a reason, and Cancel changes nothing', async () => {
    const owner = await newWorkshop('Quillbrook Bars')
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const piece = set.pieces[0] as { id: string }
    const page = await newPage()
    await signInAs(page, owner.email, owner.password)
    await page.goto(`${BASE_URL}/pieces/${piece.id}`)
    const dialog = page.getByTestId('confirm-dialog')
    await page.getByRole('button', { name: 'Move to scrapped' }).click()
    await dialog.getByRole('heading', { name: 'Scrap this piece?' }).waitFor()
    expect(await dialog.getByRole('button', { name: 'Scrap piece' }).isDisabled()).toBe(true)
    await screenshot(page, 'confirm-scrap')
    await dialog.getByRole('button', { name: 'Cancel' }).click()
    await dialog.getByRole('heading', { name: 'Scrap this piece?' }).waitFor({ state: 'detached' })
    expect((await api(`/api/pieces/${piece.id}`, { token: owner.token })).body.stage).toBe('blank')
    await page.getByRole('button', { name: 'Move to scrapped' }).click()
    await dialog.getByLabel('Why is it scrapped?').fill('Knot through the node')
    await dialog.getByRole('button', { name: 'Scrap piece' }).click()
    await expect.poll(async () => (await api(`/api/pieces/${piece.id}`, { token: owner.token })).body.stage).toBe('scrapped')
  })
})
