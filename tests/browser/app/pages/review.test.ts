import { randomInt } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { encodeWav } from '../../../../shared/analysis/index'
import { KEY_ACTIONS } from '../../../../shared/keys'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'
import { api, signIn } from '../../../integration/support/http'
import { BASE_URL, DEMO_PASSWORD, screenshot, signInAs, useBrowser } from '../../support/browser'
import { ROLES, expectText } from '../../support/screens'

const browser = useBrowser()

// A small glockenspiel set of our own: A5 and B5 struck twice (9 ¢, then 0.5 ¢ sharp) by the demo
// benchmaker and sent to review, so the desk can be filtered to exactly these two.
const fixture = { setId: '', setName: '', pieces: {} as Record<string, string> }

beforeAll(async () => {
  const owner = await signIn(ROLES.owner.email, DEMO_PASSWORD)
  const bench = await signIn(ROLES.benchmaker.email, DEMO_PASSWORD)
  const templates = await api('/api/templates', { token: owner })
  const glock = templates.body.find((t: { name: string }) => t.name.startsWith('Glockenspiel'))
  fixture.setName = `Review desk check ${randomInt(100000, 1000000)}`
  const created = await api('/api/sets', {
    method: 'POST', token: owner,
    body: { name: fixture.setName, model: 'Desk plate', serial: `RD-${randomInt(10000000, 100000000)}`, buyer: { name: 'Ada Fenwick', email: 'ada@example.test' }, referenceHz: 440, fromNote: 'A5', toNote: 'B5', chromatic: false, templateId: glock.id },
  })
  expect(created.status).toBe(201)
  fixture.setId = created.body.id
  const set = await api(`/api/sets/${fixture.setId}`, { token: owner })
  for (const p of set.body.pieces as { id: string, note: string, targetHz: number }[]) {
    fixture.pieces[p.note] = p.id
    for (const seed of [3, 4]) {
      const samples = synthStrike([{ frequencyHz: p.targetHz * 2 ** ((seed === 3 ? 9 : 0.5) / 1200), amplitudeDb: -10, decayDbPerS: 8 }], { sampleRate: 48_000, durationS: 1.2, onsetS: 0.1, noiseDb: -75, seed })
      const form = new FormData()
      form.append('file', new Blob([encodeWav(samples, 48_000)], { type: 'audio/wav' }), 'strike.wav')
      form.append('temperatureC', '21')
      expect((await api(`/api/pieces/${p.id}/strikes`, { method: 'POST', token: bench, body: form })).status).toBe(201)
    }
    expect((await api(`/api/pieces/${p.id}/stage`, { method: 'POST', token: bench, body: { to: 'review' } })).status).toBe(200)
  }
})

describe('review desk', () => {
  it('filters by set in the URL, groups, undoes an approval within its window, and shows the keys with ?', async () => {
    const page = await browser.newPage()
    await signInAs(page, ROLES.supervisor.email)
    await page.goto(`${BASE_URL}/review?set=${fixture.setId}`)
    await page.getByRole('heading', { name: 'Review', level: 1 }).waitFor()
    const items = page.getByTestId('queue-item')
    await expectText(page.getByTestId('review-count'), /^2 pieces waiting/)
    expect(await items.count()).toBe(2)
    expect(await items.filter({ hasText: fixture.setName }).count()).toBe(2)
    // Each piece shows its convergence: a trail in the queue and the chart of the open piece, with a play button.
    expect(await items.first().getByTestId('cents-trail').getAttribute('aria-label')).toMatch(/last 2 strikes/)
    const current = page.getByTestId('review-current')
    await current.getByTestId('convergence').waitFor()
    await current.getByTestId('strike-play').waitFor()

    // Grouped by set: the choice goes into the URL too.
    await page.getByLabel('Group by').selectOption('set')
    await page.waitForURL(url => url.searchParams.get('group') === 'set' && url.searchParams.get('set') === fixture.setId)
    await expectText(page.getByTestId('queue-group'), new RegExp(`${fixture.setName} · 2`))
    await screenshot(page, 'review-desk-1280x800')

    // `?` opens the panel of this page's keys from the one key map; `?` again closes it.
    await page.keyboard.press('?')
    const panel = page.getByTestId('keys-panel')
    await panel.waitFor()
    await expectText(panel, new RegExp(KEY_ACTIONS.returnForRework.meaning.replace(/[()]/g, '\\$&')))
    expect(await panel.getByText(KEY_ACTIONS.sendToReview.meaning).count()).toBe(0)
    await screenshot(page, 'review-keys-1280x800')
    await page.keyboard.press('?')
    await panel.waitFor({ state: 'detached' })

    // Approve the open piece with `a`; it leaves the queue; `u` within the window brings it back.
    const note = (await current.getByRole('heading').first().innerText()).split(' ')[0]!
    await page.keyboard.press('a')
    await page.getByRole('alert').filter({ hasText: `${note} of ${fixture.setName} approved` }).waitFor()
    await page.getByTestId('review-undo').waitFor()
    await expectText(page.getByTestId('review-count'), /^1 piece waiting/)
    await page.keyboard.press('u')
    await page.getByRole('alert').filter({ hasText: 'Approval undone' }).waitFor()
    await expectText(page.getByTestId('review-count'), /^2 pieces waiting/)
    await expectText(current.getByRole('heading').first(), new RegExp(`^${note}\\b`))
    const owner = await signIn(ROLES.owner.email, DEMO_PASSWORD)
    expect((await api(`/api/pieces/${fixture.pieces[note]}`, { token: owner })).body).toMatchObject({ stage: 'review', approvedStrikeId: null })

    // Portrait tablet.
    await page.setViewportSize({ width: 800, height: 1280 })
    await current.getByTestId('convergence').waitFor()
    await screenshot(page, 'review-desk-800x1280')
    await page.close()
  })
})
