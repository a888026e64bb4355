import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createDatabase } from '../../../../server/database/client'
import { ENGINE_VERSION } from '../../../../shared/analysis/version'
import { newWorkshop } from '../../../integration/support/http'
import { createSet, postStrike, strikeWav } from '../../../integration/support/records'
import { BASE_URL, launch, screenshot, signInAs } from '../../support/browser'

let session: Awaited<ReturnType<typeof launch>>
let owner: Awaited<ReturnType<typeof newWorkshop>>
let set: { id: string, pieces: { id: string, targetHz: number }[] }
const { client: sql } = createDatabase(process.env.NUXT_DATABASE_URL!, { max: 1 })

beforeAll(async () => {
  session = await launch()
  owner = await newWorkshop('Re-measure screens')
  set = await createSet(owner.token, { fromNote: 'C4', toNote: 'D4' })
  const piece = set.pieces[0]!
  const strike = await postStrike(owner.token, piece.id, strikeWav(piece.targetHz, [1, 4], [0.3, 0]))
  // As if an older engine had read the fundamental 6 ¢ sharp.
  await sql`update strikes set engine_version = '0.9.0', verdict = 'outside', worst_cents = worst_cents + 6,
    analysis = jsonb_set(analysis, '{matches,0,cents}', to_jsonb((analysis #>> '{matches,0,cents}')::float8 + 6)) where id = ${strike.body.id}`
})
afterAll(async () => {
  await session?.close()
  await sql.end()
})

describe('re-measure screens', () => {
  it('the owner re-measures a set from its page and sees what changed, then the piece\'s strikes show the engine', async () => {
    const page = await session.newPage()
    await signInAs(page, owner.email, owner.password)
    // The server-drawn page offers the button disabled: a click before the page runs in the browser would be lost.
    const html = await (await page.request.get(`${BASE_URL}/sets/${set.id}`)).text()
    expect(html).toMatch(/<button[^>]*disabled[^>]*>\s*Re-measure with engine/)
    await page.goto(`${BASE_URL}/sets/${set.id}`)
    // Enabled once the page runs in the browser: a slow machine may take a while to get there.
    await page.getByRole('button', { name: `Re-measure with engine ${ENGINE_VERSION}` }).click({ timeout: 60_000 })
    // The run measures audio on a machine that may be busy: its progress shows while it waits its turn.
    const row = page.getByTestId('reanalysis-change-row').first()
    await row.or(page.getByTestId('reanalysis-progress')).first().waitFor({ timeout: 30_000 })
    await row.waitFor({ timeout: 90_000 })
    expect(await row.textContent()).toContain(`0.9.0 → ${ENGINE_VERSION}`)
    expect(await page.getByTestId('reanalysis-summary').textContent()).toMatch(/1 verdict changed/)
    await screenshot(page, 'set-reanalysis')
    await page.goto(`${BASE_URL}/pieces/${set.pieces[0]!.id}`)
    expect(await page.getByTestId('strike-engine').first().textContent()).toContain(ENGINE_VERSION)
    await page.close()
  }, 180_000)
})
