import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api } from '../../../integration/support/http'
import { approveAll, approvedSet } from '../../../integration/support/certified-set'
import { waitForMailTo } from '../../../integration/support/mail'
import { BASE_URL, launch, screenshot, signInAs } from '../../support/browser'

let session: Awaited<ReturnType<typeof launch>>
let ctx: Awaited<ReturnType<typeof approvedSet>>
let cert: { id: string, number: string, code: string }
const OFFICE_PASSWORD = 'dispatch-desk-password'

beforeAll(async () => {
  session = await launch()
  ctx = await approvedSet({ from: 'C5', to: 'G5' })
  await approveAll(ctx)
  cert = (await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })).body
  // The office member chose a password of their own at first sign-in (memberWithRole); here a second change.
  const changed = await api('/api/auth/password', { method: 'POST', token: ctx.office.token, body: { currentPassword: ctx.office.password, newPassword: OFFICE_PASSWORD } })
  if (changed.status !== 200) throw new Error(`password change: ${changed.status} ${JSON.stringify(changed.body)}`)
})
afterAll(async () => {
  await session?.close()
})

describe('certificate screens', () => {
  it('the office sees the certificate and queues the e-mail, which the catcher receives with the PDF', async () => {
    const page = await session.newPage()
    await signInAs(page, ctx.office.email, OFFICE_PASSWORD)
    await page.goto(`${BASE_URL}/certificates`)
    await page.getByText(cert.number).first().waitFor()
    // "PDF pending" until the job has stored it; the list asks again by itself.
    await page.getByRole('link', { name: 'PDF (A4)' }).first().waitFor({ timeout: 60_000 })
    expect(await page.getByRole('button', { name: 'Revoke…' }).count()).toBe(0)
    await page.getByRole('button', { name: 'Send…' }).click()
    await page.getByRole('button', { name: 'Queue e-mail' }).click()
    await page.getByRole('status').filter({ hasText: 'Queued for' }).waitFor()
    await screenshot(page, 'certificates-office')
    // The production build has no Mailbox screen: the caught mail is read from the catcher's folder.
    const message = await waitForMailTo(ctx.buyerEmail)
    expect(message.subject).toContain(`Tuning certificate ${cert.number}`)
    expect(message.attachments.map(a => a.filename)).toContain(`${cert.number}.pdf`)
    await page.close()
  })

  it('anyone can open the verification page without signing in', async () => {
    const page = await session.newPage()
    await page.goto(`${BASE_URL}/verify/${cert.code}`)
    await page.getByRole('heading', { name: cert.number }).waitFor()
    expect(await page.getByText('Valid', { exact: true }).isVisible()).toBe(true)
    expect(await page.getByText('Fernhill Community School').isVisible()).toBe(true)
    expect(await page.content()).not.toContain(ctx.buyerEmail)
    await screenshot(page, 'verify-valid')
    await page.goto(`${BASE_URL}/verify/AAAAAAAAAAAAAAAA`)
    await page.getByRole('heading', { name: 'No such certificate' }).waitFor()
    await page.close()
  })
})
