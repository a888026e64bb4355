import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api } from '../support/http'
import { testSql } from '../support/mail'
import { approveAll, approvedSet } from '../support/certified-set'
import { allRoutes, bodyFor, recordsOf, urlFor, type RecordIds } from './routes'

// Class guarded: "Racing requests get a 2xx, a 4xx or a 409 (or a full queue's 503 with Retry-After), never a 500", on every route that changes
// something: the same valid request sent six times at once by the workshop's owner.

afterAll(async () => {
  await testSql().end()
})

const CHANGES = /^(POST|PUT|PATCH|DELETE) /
/** Routes that are not about a workshop's records (signing in and out, accounts, sign-up limits). */
const LEFT_OUT = /^POST \/api\/(auth\/|invitations\/|workshops$)/

let ids: RecordIds
let owner: string

beforeAll(async () => {
  const ctx = await approvedSet({ from: 'C5', to: 'C5' })
  await approveAll(ctx)
  const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })
  if (signed.status !== 201) throw new Error(`sign: ${signed.status} ${JSON.stringify(signed.body)}`)
  owner = ctx.owner.token
  ids = { ...await recordsOf(owner, ctx.bench.userId), certificate: signed.body.id ?? signed.body.certificate?.id }
  const [mail] = await testSql()<{ id: string }[]>`select id from mail_messages where workshop_id = ${ctx.owner.workshopId} limit 1`
  ids.mail = mail?.id ?? ''
}, 300_000)

describe('web: racing requests on every route that changes something', () => {
  it('never answers 5xx, but a full queue 503 with Retry-After, to six identical requests at once', { timeout: 600_000 }, async () => {
    const routes = allRoutes().filter(r => CHANGES.test(r) && !LEFT_OUT.test(r))
    expect(routes.length).toBeGreaterThan(30)
    const failures: string[] = []
    for (const route of routes) {
      const url = urlFor(route, ids)
      if (!url) {
        failures.push(`${route}: the walk has no record for its id`)
        continue
      }
      const method = route.split(' ')[0]
      const replies = await Promise.all(Array.from({ length: 6 }, () => api(url, { method, token: owner, body: bodyFor(route, ids) })))
      // A full measuring queue is the one 5xx allowed: 503 with Retry-After and a sentence (pool-analysis-workers.test.ts).
      const bad = replies.filter(r => r.status >= 500 && !(r.status === 503 && r.headers.get('retry-after') && typeof r.body?.message === 'string'))
      if (bad.length) failures.push(`${route} → ${bad.map(r => r.status).join(',')} ${JSON.stringify(bad[0]!.body).slice(0, 100)}`)
    }
    expect(failures).toEqual([])
  })
})
