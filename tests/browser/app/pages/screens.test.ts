import { randomInt } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { encodeWav } from '../../../../shared/analysis/index'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'
import { api, signIn } from '../../../integration/support/http'
import { BASE_URL, DEMO_PASSWORD, launch, screenshot, signInAs, type Page } from '../../support/browser'
import { ROLES, expectText } from '../../support/screens'

let session: Awaited<ReturnType<typeof launch>>

/** The screens built here, with the heading each opens with. */
const HEADINGS: Record<string, string> = { '/pieces': 'Pieces', '/sets': 'Sets', '/lots': 'Lots', '/review': 'Review', '/templates': 'Templates', '/team': 'Team' }

/** A synthetic strike on one piece: its fundamental, `cents` away from the target. */
function strikeWav(targetHz: number, cents: number) {
  const samples = synthStrike([{ frequencyHz: targetHz * 2 ** (cents / 1200), amplitudeDb: -10, decayDbPerS: 8 }], {
    sampleRate: 48_000, durationS: 1.5, onsetS: 0.15, noiseDb: -75, seed: 7,
  })
  return encodeWav(samples, 48_000)
}

async function strike(token: string, pieceId: string, targetHz: number, cents: number) {
  const form = new FormData()
  form.append('file', new Blob([strikeWav(targetHz, cents)], { type: 'audio/wav' }), 'strike.wav')
  form.append('temperatureC', '21')
  const reply = await api(`/api/pieces/${pieceId}/strikes`, { method: 'POST', token, body: form })
  if (reply.status !== 201) throw new Error(`strike failed: ${reply.status} ${JSON.stringify(reply.body)}`)
  return reply.body
}

// A small glockenspiel set of our own, made through the API: C6, D6 and G6 struck
// in tune, E6 struck 20 ¢ sharp (its tolerance is ±3 ¢), F6 left blank; the struck
// ones sent to review.
const fixture = { setId: '', setName: '', pieces: {} as Record<string, { id: string, targetHz: number }> }

beforeAll(async () => {
  session = await launch()
  const owner = await signIn(ROLES.owner.email, DEMO_PASSWORD)
  const bench = await signIn(ROLES.benchmaker.email, DEMO_PASSWORD)
  const templates = await api('/api/templates', { token: owner })
  const glock = templates.body.find((t: { name: string }) => t.name.startsWith('Glockenspiel'))
  // Digits only: a hex suffix such as "c6" would also match a note name in the grid's text filters.
  fixture.setName = `Browser check glockenspiel ${randomInt(100000, 1000000)}`
  const created = await api('/api/sets', {
    method: 'POST', token: owner,
    body: { name: fixture.setName, model: 'Check plate', serial: `BC-${randomInt(10000000, 100000000)}`, buyer: { name: 'Ada Fenwick', email: 'ada@example.test' }, referenceHz: 440, fromNote: 'C6', toNote: 'G6', chromatic: false, templateId: glock.id },
  })
  expect(created.status).toBe(201)
  fixture.setId = created.body.id
  const set = await api(`/api/sets/${fixture.setId}`, { token: owner })
  for (const p of set.body.pieces) fixture.pieces[p.note] = { id: p.id, targetHz: p.targetHz }
  for (const [note, cents] of [['C6', 0.4], ['D6', -0.6], ['E6', 20], ['G6', 1.1]] as const) {
    const piece = fixture.pieces[note]!
    for (const to of ['tuning', 'review']) {
      if (to === 'review') await strike(bench, piece.id, piece.targetHz, cents)
      const moved = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: bench, body: { to } })
      expect(moved.status).toBe(200)
    }
  }
})
afterAll(async () => {
  await session?.close()
})

async function navLabels(page: Page) {
  const links = page.getByRole('navigation', { name: 'Main' }).getByRole('link')
  return (await links.allInnerTexts()).map(t => t.trim())
}

describe('screens by role', () => {
  for (const [role, spec] of Object.entries(ROLES)) {
    it(`${role}: sees exactly its navigation, opens its screens and is turned away from the others`, async () => {
      const page = await session.newPage()
      await signInAs(page, spec.email)
      await page.getByRole('heading', { name: 'Pieces by stage, per set' }).waitFor()
      expect(await navLabels(page)).toEqual(spec.nav)
      await screenshot(page, `dashboard-${role}`)
      for (const path of spec.nav.map(label => `/${label.toLowerCase()}`).filter(p => HEADINGS[p])) {
        await page.goto(`${BASE_URL}${path}`)
        await page.getByRole('heading', { name: HEADINGS[path], exact: true, level: 1 }).waitFor()
      }
      for (const path of spec.forbidden) {
        await page.goto(`${BASE_URL}${path}`)
        await page.waitForURL(url => url.pathname === '/' && url.searchParams.get('denied') === path)
        await page.getByRole('alert').filter({ hasText: `cannot open ${path}` }).waitFor()
      }
      await page.close()
    })
  }
})

describe('review', () => {
  it('supervisor approves from the keyboard, gives an override reason for a sharp piece, and sees a lost race as a plain message', async () => {
    const page = await session.newPage()
    await signInAs(page, ROLES.supervisor.email)
    await page.goto(`${BASE_URL}/review`)
    await page.getByRole('heading', { name: 'Review', level: 1 }).waitFor()
    const item = (note: string) => page.getByTestId('queue-item').filter({ hasText: fixture.setName }).filter({ hasText: note })
    const current = page.getByTestId('review-current')

    // C6, struck within: one key approves it.
    await item('C6').click()
    await current.getByRole('heading', { name: /C6/ }).waitFor()
    await current.getByTestId('ladder-row').first().waitFor()
    expect(await current.getByTestId('ladder-row').first().getAttribute('data-state')).toBe('within')
    await screenshot(page, 'review-supervisor')
    await page.keyboard.press('a')
    await page.getByRole('alert').filter({ hasText: `C6 of ${fixture.setName} approved` }).waitFor()
    await item('C6').waitFor({ state: 'detached' })

    // E6, 20 ¢ sharp: `a` asks for a reason; keys typed into it stay text.
    await item('E6').click()
    await current.getByRole('heading', { name: /E6/ }).waitFor()
    expect(await current.getByTestId('ladder-row').first().getAttribute('data-state')).toBe('sharp')
    await page.keyboard.press('a')
    const reason = page.getByLabel('Override reason (the latest strike is not within)')
    await expect.poll(() => reason.evaluate(el => el === document.activeElement)).toBe(true)
    await page.keyboard.type('Buyer asked for a bright top plate; agreed by phone')
    expect(await reason.inputValue()).toBe('Buyer asked for a bright top plate; agreed by phone')
    expect(await current.getByRole('heading', { name: /E6/ }).count()).toBe(1)
    await screenshot(page, 'review-override')
    await page.keyboard.press('Control+Enter')
    await page.getByRole('alert').filter({ hasText: `E6 of ${fixture.setName} approved` }).waitFor()

    // D6: another supervisor (the owner, through the API) approves it first.
    await item('D6').click()
    await current.getByRole('heading', { name: /D6/ }).waitFor()
    const owner = await signIn(ROLES.owner.email, DEMO_PASSWORD)
    const piece = await api(`/api/pieces/${fixture.pieces.D6!.id}`, { token: owner })
    const first = await api(`/api/pieces/${fixture.pieces.D6!.id}/approve`, { method: 'POST', token: owner, body: { strikeId: piece.body.strikes[0].id } })
    expect(first.status).toBe(200)
    await page.keyboard.press('a')
    await expectText(page.getByTestId('review-conflict'), /already approved/)
    await item('D6').waitFor({ state: 'detached' })

    // G6: `x` opens the reason for rework, which is sent with Ctrl+Enter.
    await item('G6').click()
    await current.getByRole('heading', { name: /G6/ }).waitFor()
    await page.keyboard.press('x')
    const comment = page.getByLabel('What needs rework?')
    await expect.poll(() => comment.evaluate(el => el === document.activeElement)).toBe(true)
    await page.keyboard.type('Chip on the near edge; dress it and strike again')
    await page.keyboard.press('Control+Enter')
    await page.getByRole('alert').filter({ hasText: `G6 of ${fixture.setName} returned for rework` }).waitFor()
    await item('G6').waitFor({ state: 'detached' })
    await page.close()
  })
})

describe('pieces', () => {
  it('filters from the URL, changes stages in bulk all or nothing, and opens a piece', async () => {
    const page = await session.newPage()
    await signInAs(page, ROLES.supervisor.email)
    await page.goto(`${BASE_URL}/pieces?set=${fixture.setId}`)
    await page.getByRole('heading', { name: 'Pieces', level: 1 }).waitFor()
    await expectText(page.getByTestId('pieces-count'), /of 5 pieces/)
    await page.getByLabel('Stage', { exact: true }).selectOption('approved')
    await page.waitForURL(url => url.searchParams.get('stage') === 'approved' && url.searchParams.get('set') === fixture.setId, { timeout: 60_000 })
    await expectText(page.getByTestId('pieces-count'), /of 3 pieces/)
    await page.getByLabel('Latest verdict').selectOption('outside')
    await expectText(page.getByTestId('pieces-count'), /of 1 piece · /)
    await page.getByLabel('Stage', { exact: true }).selectOption('')
    await page.getByLabel('Latest verdict').selectOption('')
    await expectText(page.getByTestId('pieces-count'), /of 5 pieces/)
    await page.getByLabel('Stage', { exact: true }).selectOption('rework')
    await expectText(page.getByTestId('pieces-count'), /of 1 piece · /)
    expect(await page.getByTestId('piece-row').innerText()).toContain('G6')
    await page.getByLabel('Stage', { exact: true }).selectOption('')
    await expectText(page.getByTestId('pieces-count'), /of 5 pieces/)
    await page.getByRole('button', { name: /Latest worst ¢/ }).click()
    await page.waitForURL(url => url.searchParams.get('sort') === 'cents', { timeout: 60_000 })
    await screenshot(page, 'pieces-supervisor')

    // F6 (blank) with C6 (approved): the approved one stops the whole change.
    await page.getByLabel(`Select F6 of ${fixture.setName}`).check()
    await page.getByLabel(`Select C6 of ${fixture.setName}`).check()
    await page.getByLabel('Move to stage').selectOption('roughed')
    await page.getByRole('button', { name: 'Change stage' }).click()
    await expectText(page.getByRole('alert').filter({ hasText: 'Nothing was changed' }), /C6.*approved/)
    // By its checkbox, not its text: the set's random suffix can itself contain "f6".
    const f6 = page.getByTestId('piece-row').filter({ has: page.getByLabel(`Select F6 of ${fixture.setName}`) })
    expect(await f6.locator('[data-stage]').getAttribute('data-stage')).toBe('blank')
    await page.getByLabel(`Select C6 of ${fixture.setName}`).uncheck()
    await page.getByRole('button', { name: 'Change stage' }).click()
    await page.getByRole('alert').filter({ hasText: '1 piece moved to roughed' }).waitFor()
    await expect.poll(() => f6.locator('[data-stage]').getAttribute('data-stage')).toBe('roughed')

    await page.getByRole('link', { name: 'E6', exact: true }).click()
    await page.getByRole('heading', { name: /Piece E6/ }).waitFor()
    await page.getByTestId('strike-row').first().waitFor()
    expect(await page.getByTestId('strike-row').count()).toBe(1)
    await page.getByText('Override:').waitFor()
    expect(await page.getByRole('link', { name: 'Open on the Bench' }).getAttribute('href')).toBe(`/bench?piece=${fixture.pieces.E6!.id}`)
    await screenshot(page, 'piece-page')

    // Reopening an approval asks for a reason and puts the piece back in tuning.
    await page.getByRole('button', { name: 'Reopen approval…' }).click()
    await page.getByLabel(/Why reopen/).fill('Plate chipped in packing; retune after filing')
    await page.getByRole('button', { name: 'Reopen', exact: true }).click()
    await page.getByRole('heading', { name: /Piece E6/ }).locator('[data-stage="tuning"]').waitFor()
    await page.getByText(/^Reopened by /).waitFor()

    // A supervisor hands the piece to a member.
    await page.getByLabel('Assigned to').selectOption({ label: 'Corin Hale' })
    await page.locator('dd', { hasText: 'Corin Hale' }).waitFor()
    await page.close()
  }, 180_000)
})
