import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { fileURLToPath } from 'node:url'
import type { Permission } from '../../../shared/auth/roles'
import { api } from '../support/http'
import { testSql, until } from '../support/mail'
import { createSet, postStrike, strikeWav } from '../support/records'

const API_DIR = fileURLToPath(new URL('../../../server/api', import.meta.url))

/** Every route file under server/api, as "METHOD /api/path/:param". */
export function allRoutes(dir = API_DIR): string[] {
  return routeFiles(dir).map(r => r.route)
}

function routeFiles(dir = API_DIR): { route: string, file: string }[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name)
    if (statSync(path).isDirectory()) return routeFiles(path)
    const match = /^(.*)\.(get|post|put|patch|delete)\.ts$/.exec(relative(API_DIR, path))
    if (!match) return []
    const route = `/api/${match[1]!.replace(/(^|\/)index$/, '')}`.replace(/\/$/, '').replace(/\[(\w+)\]/g, ':$1')
    return [{ route: `${match[2]!.toUpperCase()} ${route}`, file: path }]
  })
}

/** The re-measure routes hand their guard to one shared function; its permission is named there. */
const DELEGATED: Record<string, Permission> = {
  'POST /api/pieces/:id/reanalyze': 'strikes:reanalyze',
  'POST /api/sets/:id/reanalyze': 'strikes:reanalyze',
}

/** The permission each signed-in route asks for, read from its handler (`requireMember(event, '…')`). */
export function routePermissions(): Map<string, Permission | null> {
  return new Map(routeFiles().map(({ route, file }) => {
    const match = /requireMember\(event, '([\w:]+)'\)/.exec(readFileSync(file, 'utf8'))
    return [route, (match?.[1] as Permission | undefined) ?? DELEGATED[route] ?? null]
  }))
}

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

export type RecordIds = Record<string, string>

/** The route's path with the id of the record kind it names, or null when the walk has no such record. */
export function urlFor(route: string, ids: RecordIds): string | null {
  const path = route.split(' ')[1]!
  if (!/:\w+/.test(path)) return path
  const kind = KIND_OF.find(([pattern]) => pattern.test(path))?.[1]
  return kind && ids[kind] ? path.replace(/:\w+/, ids[kind]!) : null
}

/** A body each route would accept for a record of the caller's own workshop, so that only the id or the role can refuse it. */
export function bodyFor(route: string, ids: RecordIds): unknown {
  const [method] = route.split(' ')
  if (method === 'GET' || method === 'DELETE') return undefined
  if (['POST /api/pieces/:id/strikes', 'POST /api/analyze', 'POST /api/calibrations'].includes(route)) {
    const form = new FormData()
    form.set('file', new Blob([strikeWav(261.63, [1, 4], [0, 0])], { type: 'audio/wav' }), 'strike.wav')
    if (route === 'POST /api/calibrations') {
      form.set('referenceHz', '1000')
      form.set('device', 'Walk input')
    }
    return form
  }
  const bodies: Record<string, unknown> = {
    'POST /api/pieces/:id/stage': { to: 'roughed' },
    'POST /api/pieces/:id/approve': { strikeId: ids.strike },
    'POST /api/pieces/:id/return': { comment: 'Fundamental still sharp' },
    'POST /api/pieces/:id/reopen': { reason: 'Checking again' },
    'POST /api/pieces/:id/assign': { assigneeId: null },
    'PATCH /api/sets/:id': { notes: 'Changed by a stranger' },
    'PATCH /api/lots/:id': { notes: 'Changed by a stranger' },
    'POST /api/lots/:id/pieces': { pieceIds: [ids.ownPiece ?? ids.piece] },
    'POST /api/certificates/:id/revoke': { reason: 'Revoked by a stranger' },
    'POST /api/certificates/:id/reissue': { reason: 'Re-issued by a stranger' },
    'POST /api/sets/:id/service': { kind: 'retune', receivedOn: '2026-11-02', reason: 'Booked in by a stranger' },
    'PATCH /api/team/:userId': { role: 'office' },
    'POST /api/blanks/:id/piece': { pieceId: ids.ownPiece ?? ids.piece },
    'PUT /api/pieces/:id/geometry': {
      material: 'rosewood',
      geometry: { lengthMm: 400, widthMm: 50, profile: [{ xMm: 0, thicknessMm: 22 }, { xMm: 400, thicknessMm: 22 }], densityKgM3: 850, youngsModulusGPa: 20 },
    },
    'PUT /api/templates/:id': { family: 'bar', name: 'Renamed by a stranger', partials: [{ label: 'f', ratio: 1, toleranceCents: 3, required: true }] },
  }
  return bodies[route] ?? {}
}

/** One record of each kind a route can name, made through the API in the workshop of `token` (an owner's). */
export async function recordsOf(token: string, userId: string): Promise<RecordIds> {
  const set = await createSet(token, { fromNote: 'C4', toNote: 'C4' })
  const piece = set.pieces[0]
  const strike = await postStrike(token, piece.id, strikeWav(piece.targetHz, [1, 4], [0, 0]))
  const lot = await api('/api/lots', { method: 'POST', token, body: { code: `WALK-${Date.now()}`, material: 'rosewood' } })
  const invitation = await api('/api/team/invitations', { method: 'POST', token, body: { email: `walk-${Date.now()}@example.test`, role: 'office' } })
  const blank = await api('/api/blanks', { method: 'POST', token, body: { species: 'rosewood', lengthMm: 400, widthMm: 50, thicknessMm: 22, massG: 374, f1Hz: 300 } })
  const run = await api(`/api/sets/${set.id}/reanalyze`, { method: 'POST', token, body: {} })
  const templates = await api('/api/templates', { token })
  for (const reply of [strike, lot, invitation, blank, run]) {
    if (reply.status >= 300) throw new Error(`walk records: ${reply.status} ${JSON.stringify(reply.body)}`)
  }
  // A run that is still working would change the rows the walks compare; wait for it to end first.
  await until('the re-measurement to finish', async () => ['done', 'failed'].includes((await api(`/api/reanalysis/${run.body.id}`, { token })).body?.status), 90_000, 500)
  return {
    set: set.id, piece: piece.id, strike: strike.body.id, lot: lot.body.id, invitation: invitation.body.id, blank: blank.body.id,
    reanalysis: run.body.id, template: templates.body[0].id, member: userId,
  }
}

/** Tables whose rows of a workshop must not change when a request is refused. */
const TABLES = ['sets', 'pieces', 'strikes', 'strike_analyses', 'reviews', 'lots', 'ratio_templates', 'template_versions',
  'invitations', 'blanks', 'reanalysis_runs', 'cut_plans', 'memberships', 'service_records', 'calibrations', 'certificates']

/** A count and a hash of a workshop's rows per table. */
export async function snapshot(workshopId: string): Promise<string[]> {
  const parts: string[] = []
  for (const table of TABLES) {
    const [row] = await testSql().unsafe(`select count(*)::int as n, md5(coalesce(string_agg(t::text, '|' order by t::text), '')) as h from ${table} t where workshop_id = $1`, [workshopId])
    parts.push(`${table}:${row!.n}:${row!.h}`)
  }
  return parts
}
