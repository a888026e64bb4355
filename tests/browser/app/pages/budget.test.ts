import { describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../../../integration/support/http'
import { createSet, postStrike, strikeWav } from '../../../integration/support/records'
import { BASE_URL, screenshot, signInAs, useBrowser } from '../../support/browser'
import { expectText } from '../../support/screens'

const { newPage } = useBrowser()

describe('uncertainty budget and decision rules on the screens', () => {
  it('the owner asks for three strikes before review, picks guarded acceptance, and the piece page and the Bench say what follows', async () => {
    const owner = await newWorkshop('Wrenfield Bar Works')
    const page = await newPage()
    await signInAs(page, owner.email, owner.password)

    await page.goto(`${BASE_URL}/settings`)
    await page.getByTestId('settings-repeat-strikes').check()
    await page.getByRole('button', { name: 'Save settings' }).click()
    await page.getByRole('alert').filter({ hasText: 'Saved' }).waitFor()
    expect((await api('/api/workshops/current/settings', { token: owner.token })).body.repeatStrikesBeforeReview).toBe(true)

    const set = await createSet(owner.token, { fromNote: 'A5', toNote: 'A5' })
    const piece = set.pieces[0] as { id: string, targetHz: number, templateVersionId: string }
    const struck = await postStrike(owner.token, piece.id, strikeWav(piece.targetHz, [1, 4], [0.5, 0.5], 5), { temperatureC: '20.5' })
    expect(struck.status).toBe(201)

    await page.goto(`${BASE_URL}/pieces/${piece.id}`)
    const panel = page.getByTestId('piece-budget')
    await expectText(panel, /Decision rule: simple acceptance/)
    await expectText(panel, /± \d\.\d+ ¢/)
    await panel.getByText('Uncertainty budget per partial').click()
    await expectText(panel.locator('table').first(), /estimator[\s\S]*resolution/)
    await expectText(panel, /Not assessed, repeatability: only 1 reading/)
    await expectText(panel, /No input calibration/)
    await screenshot(page, 'piece-budget')

    await page.goto(`${BASE_URL}/bench?piece=${piece.id}`)
    await expectText(page.getByTestId('strikes-advice'), /Strike twice more before review\./)
    expect(await page.getByTestId('send-review').isDisabled()).toBe(true)

    const template = (await api('/api/templates', { token: owner.token })).body[0] as { id: string }
    await page.goto(`${BASE_URL}/templates/${template.id}`)
    await page.getByRole('button', { name: /Edit \(makes version/ }).click()
    await page.getByLabel('Decision rule').selectOption('guarded')
    await page.getByRole('button', { name: 'Save as a new version' }).click()
    await expectText(page.getByTestId('template-decision-rule'), /guarded acceptance/)
  }, 120_000)
})
