import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { PERMISSIONS, type Role } from '../../../shared/auth/roles'
import { api } from '../support/http'
import { testSql } from '../support/mail'
import { approveAll, approvedSet } from '../support/certified-set'
import { waitForPdf } from '../support/certificates'
import { bodyFor, recordsOf, routePermissions, snapshot, urlFor, type RecordIds } from './routes'

// Class guarded: "A role without the right gets 403 on every route, and nothing is saved", read from
// each handler's own permission and the one role table (shared/auth/roles.ts), not from a list kept by hand.

afterAll(async () => {
  await testSql().end()
})

/** Routes for anyone, or for any signed-in person whatever their role in a workshop. */
const NOT_ROLE_GUARDED = /^(GET|POST) \/api\/(auth\/|invitations\/|verify\/|health$|ready$|workshops$)/

let ids: RecordIds
let workshopId: string
let tokens: Record<Exclude<Role, 'owner'>, string>

beforeAll(async () => {
  const ctx = await approvedSet({ from: 'C5', to: 'C5' })
  await approveAll(ctx)
  const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })
  if (signed.status !== 201) throw new Error(`sign: ${signed.status} ${JSON.stringify(signed.body)}`)
  workshopId = ctx.owner.workshopId
  tokens = { supervisor: ctx.supervisor.token, benchmaker: ctx.bench.token, office: ctx.office.token }
  ids = { ...await recordsOf(ctx.owner.token, ctx.bench.userId), certificate: signed.body.id ?? signed.body.certificate?.id }
  // The PDF is rendered by a job after signing and stored on the certificate's row: done before the
  // walk's snapshot, or a slow render landing mid-walk reads as a change a refused request made.
  await waitForPdf(ctx.office.token, ids.certificate!)
  // The invitation the records include has sent a message of the workshop's.
  const [mail] = await testSql()<{ id: string }[]>`select id from mail_messages where workshop_id = ${workshopId} limit 1`
  ids.mail = mail?.id ?? ''
}, 300_000)

describe('web: a role without the right gets 403 on every route', () => {
  it('reads every handler\'s permission, answers 403 to each role the role table leaves out, and saves nothing', { timeout: 600_000 }, async () => {
    const permissions = routePermissions()
    const unguarded = [...permissions].filter(([route, p]) => p === null && !NOT_ROLE_GUARDED.test(route)).map(([route]) => route)
    expect(unguarded, 'routes that name no permission').toEqual([])
    const before = await snapshot(workshopId)
    const failures: string[] = []
    let refused = 0
    for (const [route, permission] of permissions) {
      if (!permission) continue
      const url = urlFor(route, ids)
      if (!url) {
        failures.push(`${route}: the walk has no record for its id`)
        continue
      }
      for (const role of Object.keys(tokens) as (keyof typeof tokens)[]) {
        if ((PERMISSIONS[permission] as readonly Role[]).includes(role)) continue
        const reply = await api(url, { method: route.split(' ')[0], token: tokens[role], body: bodyFor(route, ids) })
        refused++
        if (reply.status !== 403) failures.push(`${route} as ${role} → ${reply.status} ${JSON.stringify(reply.body).slice(0, 100)}`)
        else if (typeof reply.body?.message !== 'string') failures.push(`${route} as ${role}: 403 without a sentence`)
      }
    }
    expect(failures).toEqual([])
    expect(refused).toBeGreaterThan(40)
    expect(await snapshot(workshopId)).toEqual(before)
  })
})
