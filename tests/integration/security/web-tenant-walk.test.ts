import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../support/http'
import { testSql } from '../support/mail'
import { createSet } from '../support/records'
import { allRoutes, bodyFor, recordsOf, snapshot, urlFor, type RecordIds } from './routes'

// Class guarded: "Another workshop's ids answer 404 on every route that takes an id, with a body the
// route would accept, and nothing of that workshop changes", not only on the routes a test names.

afterAll(async () => {
  await testSql().end()
})

/** Public by design: a certificate's code is what a buyer is given. */
const PUBLIC = new Set(['GET /api/verify/:code'])

let ids: RecordIds
let foreignWorkshopId: string
let me: { token: string }

beforeAll(async () => {
  const other = await newWorkshop('Walked-over workshop')
  foreignWorkshopId = other.workshopId
  // Certificates and their mail come from the demo workshop, which has a certified set.
  const [demo] = await testSql()<{ certificate: string, mail: string }[]>`
    select (select id from certificates order by created_at limit 1) as certificate,
           (select id from mail_messages where workshop_id is not null order by created_at limit 1) as mail`
  me = await newWorkshop('Walking workshop')
  const ownPiece = (await createSet(me.token, { fromNote: 'D4', toNote: 'D4' })).pieces[0].id
  ids = { ...await recordsOf(other.token, other.userId), certificate: demo!.certificate, mail: demo!.mail, ownPiece }
}, 180_000)

describe('web: another workshop\'s ids answer 404 on every route that takes one', () => {
  it('answers 404, never 2xx, and leaves the other workshop\'s records as they were', { timeout: 600_000 }, async () => {
    const before = await snapshot(foreignWorkshopId)
    const routes = allRoutes().filter(r => /:\w+/.test(r) && !PUBLIC.has(r))
    expect(routes.length).toBeGreaterThan(40)
    const failures: string[] = []
    for (const route of routes) {
      const url = urlFor(route, ids)
      if (!url) {
        failures.push(`${route}: the walk has no record for its id`)
        continue
      }
      const reply = await api(url, { method: route.split(' ')[0], token: me.token, body: bodyFor(route, ids) })
      if (reply.status !== 404) failures.push(`${route} → ${reply.status} ${JSON.stringify(reply.body).slice(0, 120)}`)
    }
    expect(failures).toEqual([])
    expect(await snapshot(foreignWorkshopId)).toEqual(before)
  })
})
