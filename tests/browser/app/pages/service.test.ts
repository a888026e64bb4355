import { describe, expect, it } from 'vitest'
import { api } from '../../../integration/support/http'
import { approveAll, approvedSet } from '../../../integration/support/certified-set'
import { BASE_URL, screenshot, signInAs, useBrowser } from '../../support/browser'
import { expectText } from '../../support/screens'

const session = useBrowser()

describe('service booking', () => {
  it('office books a shipped set in; once re-approved, a new certificate supersedes the old and the set page shows it all', async () => {
    // A small certified and shipped set of a workshop of its own, made through the API.
    const ctx = await approvedSet({ from: 'C5', to: 'E5' })
    await approveAll(ctx)
    const first = (await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })).body
    expect((await api(`/api/sets/${ctx.set.id}/ship`, { method: 'POST', token: ctx.office.token })).status).toBe(200)

    const page = await session.newPage()
    await signInAs(page, ctx.office.email, ctx.office.password)
    await page.goto(`${BASE_URL}/sets/${ctx.set.id}`)
    await page.getByRole('button', { name: 'Book in for service…' }).click()
    await page.getByLabel('Service', { exact: true }).selectOption({ label: 'Retune' })
    await page.getByLabel('Reason').fill('Top octave drifted sharp after a dry winter')
    await page.getByLabel('Condition on arrival').fill('Frame sound, two bars scuffed')
    await page.getByRole('button', { name: 'Book in for service', exact: true }).click()
    await expectText(page.getByTestId('open-service'), /In for retune since \d{4}-\d{2}-\d{2}/)
    await expectText(page.getByTestId('set-history').locator('[data-kind="serviced"]'), /Top octave drifted sharp/)
    // The Sets list marks the set as in service, by the status look's shape, colour and word.
    await page.goto(`${BASE_URL}/sets`)
    const badge = page.getByTestId('set-list').getByTestId('set-in-service')
    await expectText(badge, /^\s*In service\s*$/)
    expect(await badge.getAttribute('data-meaning')).toBe('inService')
    expect(await badge.locator('svg').getAttribute('data-shape')).toBe('return-arrow')
    expect(await badge.getAttribute('title')).toMatch(/^In for retune since \d{4}-\d{2}-\d{2}$/)
    const pieces = (await api(`/api/sets/${ctx.set.id}`, { token: ctx.office.token })).body.pieces as { stage: string }[]
    expect(new Set(pieces.map(p => p.stage))).toEqual(new Set(['tuning']))

    // The bench and the supervisor do their part through the API; the office signs nothing.
    await approveAll(ctx)
    const second = (await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })).body
    // Signing closed the visit: the list no longer says "In service".
    await page.reload()
    await page.getByTestId('set-list').getByRole('link', { name: ctx.set.name }).waitFor()
    expect(await page.getByTestId('set-in-service').count()).toBe(0)
    await page.goto(`${BASE_URL}/sets/${ctx.set.id}`)
    const recertified = page.getByTestId('set-history').locator('[data-kind="recertified"]')
    await expectText(recertified, new RegExp(`Certificate ${second.number} .*superseding ${first.number}`))
    // The first certificate's line carries its standing now, by shape and word as everywhere.
    await expectText(page.getByTestId('set-history').locator('[data-kind="certified"]'), /Superseded/)
    expect(await page.getByTestId('set-history').locator('li').evaluateAll(els => els.map(e => e.getAttribute('data-kind'))))
      .toEqual(['made', 'certified', 'shipped', 'serviced', 'recertified'])
    await screenshot(page, 'set-serviced-1280x800')
    await page.setViewportSize({ width: 800, height: 1280 })
    await screenshot(page, 'set-serviced-800x1280')
    await page.setViewportSize({ width: 1280, height: 800 })

    // The old certificate still verifies, and says which one replaced it.
    await page.goto(`${BASE_URL}/verify/${first.code}`)
    await page.getByRole('link', { name: `certificate ${second.number}` }).waitFor()
    await page.close()
  })
})
