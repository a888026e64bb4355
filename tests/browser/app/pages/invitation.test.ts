import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { newWorkshop, uniqueEmail } from '../../../integration/support/http'
import { waitForMailTo } from '../../../integration/support/mail'
import { BASE_URL, launch, screenshot, signInAs } from '../../support/browser'

let session: Awaited<ReturnType<typeof launch>>

beforeAll(async () => {
  session = await launch()
})
afterAll(async () => {
  await session?.close()
})

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
