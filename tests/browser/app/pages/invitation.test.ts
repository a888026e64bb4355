import { describe, expect, it } from 'vitest'
import { api, newWorkshop, uniqueEmail } from '../../../integration/support/http'
import { waitForMailTo } from '../../../integration/support/mail'
import { BASE_URL, screenshot, signInAs, useBrowser } from '../../support/browser'

const session = useBrowser()

describe('invitation and password reset screens', () => {
  it('the owner invites by e-mail and the invited person joins from the link', async () => {
    const email = uniqueEmail('joiner')
    // A workshop of its own, so the demo workshop's team stays as other tests expect it.
    const workshop = await newWorkshop('Saltmarsh Glockenspiels')
    const owner = await session.newPage()
    await signInAs(owner, workshop.email, workshop.password)
    await owner.goto(`${BASE_URL}/team`)
    const form = owner.locator('form', { has: owner.getByRole('heading', { name: 'Invite by e-mail' }) })
    await form.getByLabel('E-mail').fill(email)
    await form.getByLabel('Role').selectOption('benchmaker')
    await form.getByRole('button', { name: 'Send invitation' }).click()
    await owner.getByText(`An invitation is on its way to ${email}`).waitFor()
    await owner.close()

    const link = /https?:\/\/\S+\/join\?token=[\w-]+/.exec((await waitForMailTo(email)).text)![0]
    const page = await session.newPage()
    await page.goto(link)
    await page.getByRole('heading', { name: 'Join Saltmarsh Glockenspiels' }).waitFor()
    await screenshot(page, 'join')
    await page.getByLabel('Your name').fill('Tomas Reyling')
    await page.getByLabel('Choose a password').fill('struck-bars-all-day')
    await page.getByRole('button', { name: 'Join the workshop' }).click()
    await page.waitForURL(url => url.pathname === '/', { timeout: 20_000 })
    await page.getByText('Tomas Reyling').first().waitFor({ timeout: 15_000 })
    await screenshot(page, 'joined')
    await page.close()
  })

  it('the owner sees a pending invitation on the Team screen and revokes it', async () => {
    const email = uniqueEmail('revoked')
    const workshop = await newWorkshop('Tidemill Chimes')
    const page = await session.newPage()
    await signInAs(page, workshop.email, workshop.password)
    await page.goto(`${BASE_URL}/team`)
    const form = page.locator('form', { has: page.getByRole('heading', { name: 'Invite by e-mail' }) })
    await form.getByLabel('E-mail').fill(email)
    await form.getByRole('button', { name: 'Send invitation' }).click()
    const row = page.getByTestId('invitation-row').filter({ hasText: email })
    await row.waitFor()
    await screenshot(page, 'team-pending-invitations')
    await row.getByRole('button', { name: `Revoke the invitation to ${email}` }).click()
    await page.getByTestId('confirm-dialog').getByRole('button', { name: 'Revoke invitation' }).click()
    await page.getByText(`The invitation to ${email} was revoked.`).waitFor()
    // The list reloads after the answer: the row leaves once it has.
    await row.waitFor({ state: 'detached' })
    expect(await page.getByTestId('invitation-row').filter({ hasText: email }).count()).toBe(0)
    await page.close()

    const link = /https?:\/\/\S+\/join\?token=[\w-]+/.exec((await waitForMailTo(email)).text)![0]
    const invited = await session.newPage()
    await invited.goto(link)
    await invited.getByRole('heading', { name: 'Invitation not valid' }).waitFor()
    await invited.close()
  })

  it('a person who already has an account signs in and then joins from the link', async () => {
    const workshop = await newWorkshop('Harrowfield Bells')
    const person = await newWorkshop('Their Own Bench')
    const owner = await session.newPage()
    await signInAs(owner, workshop.email, workshop.password)
    await owner.goto(`${BASE_URL}/team`)
    const form = owner.locator('form', { has: owner.getByRole('heading', { name: 'Invite by e-mail' }) })
    await form.getByLabel('E-mail').fill(person.email)
    await form.getByLabel('Role').selectOption('supervisor')
    await form.getByRole('button', { name: 'Send invitation' }).click()
    await owner.getByText(`An invitation is on its way to ${person.email}`).waitFor()
    await owner.close()

    const link = /https?:\/\/\S+\/join\?token=[\w-]+/.exec((await waitForMailTo(person.email)).text)![0]
    const page = await session.newPage()
    await page.goto(link)
    await page.getByRole('heading', { name: 'Join Harrowfield Bells' }).waitFor()
    await page.getByRole('link', { name: `Sign in as ${person.email}` }).click()
    await page.getByLabel('E-mail').fill(person.email)
    await page.getByLabel('Password').fill(person.password)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(url => url.pathname === '/join', { timeout: 20_000 })
    await screenshot(page, 'join-signed-in')
    await page.getByRole('button', { name: 'Join the workshop' }).click()
    await page.waitForURL(url => url.pathname === '/', { timeout: 20_000 })
    const session2 = await api('/api/auth/session', { token: person.token })
    expect(session2.body.workshops).toContainEqual(expect.objectContaining({ name: 'Harrowfield Bells', role: 'supervisor' }))
    await page.close()
  })

  it('the forgot-password form gives the same answer for any address', async () => {
    const answers: string[] = []
    for (const email of ['owner@tonewright.test', uniqueEmail('nobody')]) {
      const page = await session.newPage()
      await page.goto(`${BASE_URL}/forgot-password`)
      await page.getByLabel('E-mail').fill(email)
      await page.getByRole('button', { name: 'Send reset link' }).click()
      answers.push(await page.getByRole('alert').innerText())
      if (answers.length === 1) await screenshot(page, 'forgot-password')
      await page.close()
    }
    expect(answers[0]).toMatch(/If an account uses that address/)
    expect(answers[1]).toBe(answers[0])
  })
})
