import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../support/http'
import { testSql, until } from '../support/mail'
import { createSet, postStrike, strikeWav } from '../support/records'
import { allRoutes } from './routes'

// Class guarded: "Another workshop's ids answer 404 on every route that takes an id, with a body the
// route would accept, and nothing of that workshop changes", not only on the routes a test names.

const sql = testSql()
afterAll(async () => {
  await sql.end()
})

/** Which record kind each path's id names, by the path before it. */
const KIND_OF: [RegExp, string][] = [
  [/^\/api\/team\/invitations\/:id/, 'invitation'],
  [/^\/api\/team\/:userId/, 'member'],
  [/^\/api\/sets\/:id/, 'set'],
  [/^\/api\/pieces\/:id/, 'piece'],
  [/^\/api\/strikes\/:id/, 'strike'],
  [/^\/api\/templates\/:id/, 'template'],
  [/^\/api\/lots\/:id/, 'lot'],
  [/^\/api\/certificates\/:id/, 'certificate'],
  [/^\/api\/mail\/:id/, 'mail'],
  [/^\/api\/reanalysis\/:id/, 'reanalysis'],
  [/^\/api\/blanks\/:id/, 'blank'],
]
/** Public by design: a certificate's code is what a buyer is given. */
const PUBLIC = new Set(['GET /api/verify/:code'])

/** Tables whose rows of the other workshop must not change during the walk. */
const TABLES = ['sets', 'pieces', 'strikes', 'strike_analyses', 'reviews', 'lots', 'ratio_templates', 'template_versions',
  'invitations', 'blanks', 'reanalysis_runs', 'cut_plans', 'memberships', 'service_records', 'calibrations', 'certificates']

async function snapshot(workshopId: string) {
  const parts: string[] = []
  for (const table of TABLES) {
    const [row] = await sql.unsafe(`select count(*)::int as n, md5(coalesce(string_agg(t::text, '|' order by t::text), '')) as h from ${table} t where workshop_id = $1`, [workshopId])
    parts.push(`${table}:${row!.n}:${row!.h}`)
  }
  return parts
}

let ids: Record<string, string>
let foreignWorkshopId: string
let me: { token: string, workshopId: string }
let ownPieceId: string

beforeAll(async () => {
  const other = await newWorkshop('Walked-over workshop')
  foreignWorkshopId = other.workshopId
  const set = await createSet(other.token, { fromNote: 'C4', toNote: 'C4' })
  const piece = set.pieces[0]
  const strike = await postStrike(other.token, piece.id, strikeWav(piece.targetHz, [1, 4], [0, 0]))
  const lot = await api('/api/lots', { method: 'POST', token: other.token, body: { code: 'WALK-1', material: 'rosewood' } })
  const invitation = await api('/api/team/invitations', { method: 'POST', token: other.token, body: { email: 'walk-invitee@example.test', role: 'office' } })
  const blank = await api('/api/blanks', { method: 'POST', token: other.token, body: { species: 'rosewood', lengthMm: 400, widthMm: 50, thicknessMm: 22, massG: 374, f1Hz: 300 } })
  const run = await api(`/api/sets/${set.id}/reanalyze`, { method: 'POST', token: other.token, body: {} })
  const templates = await api('/api/templates', { token: other.token })
  for (const reply of [strike, lot, invitation, blank, run]) expect(reply.status, JSON.stringify(reply.body)).toBeLessThan(300)
  // A run that is still working would change the rows the walk checks; wait for it to end first.
  await until('the re-measurement to finish', async () => ['done', 'failed'].includes((await api(`/api/reanalysis/${run.body.id}`, { token: other.token })).body?.status), 90_000, 500)
  // Certificates and their mail come from the demo workshop, which has a certified set.
  const [demo] = await sql<{ certificate: string, mail: string }[]>`
    select (select id from certificates order by created_at limit 1) as certificate,
           (select id from mail_messages where workshop_id is not null order by created_at limit 1) as mail`
  ids = {
    set: set.id, piece: piece.id, strike: strike.body.id, lot: lot.body.id, invitation: invitation.body.id, blank: blank.body.id,
    reanalysis: run.body.id, template: templates.body[0].id, member: other.userId, certificate: demo!.certificate, mail: demo!.mail,
  }
  me = await newWorkshop('Walking workshop')
  ownPieceId = (await createSet(me.token, { fromNote: 'D4', toNote: 'D4' })).pieces[0].id
}, 180_000)

/** A body each route would accept for a record of its own workshop, so that only the id can refuse it. */
function bodyFor(route: string): unknown {
  const bodies: Record<string, unknown> = {
    'POST /api/pieces/:id/stage': { to: 'roughed' },
    'POST /api/pieces/:id/approve': { strikeId: ids.strike },
    'POST /api/pieces/:id/return': { comment: 'Fundamental still sharp' },
    'POST /api/pieces/:id/reopen': { reason: 'Checking again' },
    'POST /api/pieces/:id/assign': { assigneeId: null },
    'PATCH /api/sets/:id': { notes: 'Changed by a stranger' },
    'PATCH /api/lots/:id': { notes: 'Changed by a stranger' },
    'POST /api/lots/:id/pieces': { pieceIds: [ownPieceId] },
    'POST /api/certificates/:id/revoke': { reason: 'Revoked by a stranger' },
    'PATCH /api/team/:userId': { role: 'office' },
    'POST /api/blanks/:id/piece': { pieceId: ownPieceId },
    'POST /api/certificates/:id/reissue': { reason: 'Re-issued by a stranger' },
    'POST /api/sets/:id/service': { kind: 'retune', receivedOn: '2026-11-02', reason: 'Booked in by a stranger' },
    'PUT /api/pieces/:id/geometry': {
      material: 'rosewood',
      geometry: { lengthMm: 400, widthMm: 50, profile: [{ xMm: 0, thicknessMm: 22 }, { xMm: 400, thicknessMm: 22 }], densityKgM3: 850, youngsModulusGPa: 20 },
    },
    'PUT /api/templates/:id': { family: 'bar', name: 'Renamed by a stranger', partials: [{ label: 'f', ratio: 1, toleranceCents: 3, required: true }] },
  }
  return bodies[route] ?? {}
}

describe('web: another workshop\'s ids answer 404 on every route that takes one', () => {
  it('answers 404, never 2xx, and leaves the other workshop\'s records as they were', { timeout: 600_000 }, async () => {
    const before = await snapshot(foreignWorkshopId)
    const routes = allRoutes().filter(r => /:\w+/.test(r) && !PUBLIC.has(r))
    expect(routes.length).toBeGreaterThan(40)
    const failures: string[] = []
    for (const route of routes) {
      const [method, path] = route.split(' ') as [string, string]
      const kind = KIND_OF.find(([pattern]) => pattern.test(path))?.[1]
      if (!kind || !ids[kind]) {
        failures.push(`${route}: no record kind for its id`)
        continue
      }
      const url = path.replace(/:\w+/, ids[kind]!).replace(/:file\b/, 'a.txt')
      let body: unknown
      if (method !== 'GET' && method !== 'DELETE') {
        if (route === 'POST /api/pieces/:id/strikes') {
          body = new FormData()
          ;(body as FormData).set('file', new Blob([strikeWav(261.63, [1, 4], [0, 0])], { type: 'audio/wav' }), 'strike.wav')
        }
        else body = bodyFor(route)
      }
      const reply = await api(url, { method, token: me.token, body })
      if (reply.status !== 404) failures.push(`${route} → ${reply.status} ${JSON.stringify(reply.body).slice(0, 120)}`)
    }
    expect(failures).toEqual([])
    expect(await snapshot(foreignWorkshopId)).toEqual(before)
  })
})
