import { execFile } from 'node:child_process'
import { rm } from 'node:fs/promises'
import { join } from 'node:path'
import { promisify } from 'node:util'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createDatabase } from '../../../../../server/database/client'
import { ENGINE_VERSION } from '../../../../../shared/analysis/version'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { createSet, postStrike, strikeWav } from '../../../support/records'

// Re-measurement against the real server, its pg-boss worker and PostgreSQL. Stored
// results are aged by hand (an older engine version and a shifted deviation) so that
// re-measuring with the current engine has something to change.
const { client: sql } = createDatabase(process.env.NUXT_DATABASE_URL!, { max: 2 })
afterAll(() => sql.end())

interface Piece { id: string, targetHz: number, note: string }
let owner: Awaited<ReturnType<typeof newWorkshop>>
let supervisor: string
let benchmaker: string
let office: string
let set: { id: string, serial: string, pieces: Piece[] }
const strikeIds: string[][] = []

async function strike(piece: Piece, cents: number[], seed: number) {
  const reply = await postStrike(owner.token, piece.id, strikeWav(piece.targetHz, [1, 4], cents, seed))
  expect(reply.status, JSON.stringify(reply.body)).toBe(201)
  return reply.body.id as string
}

/** Makes a stored strike look measured by an older engine that read its fundamental 5 ¢ sharp and outside. */
async function age(strikeId: string, pieceId: string) {
  await sql`update strikes set engine_version = '0.9.0', verdict = 'outside', worst_cents = coalesce(worst_cents, 0) + 5,
    analysis = jsonb_set(analysis, '{matches,0,cents}', to_jsonb((analysis #>> '{matches,0,cents}')::float8 + 5)) where id = ${strikeId}`
  await sql`update pieces set latest_verdict = 'outside' where id = ${pieceId} and latest_strike_id = ${strikeId}`
}

async function runsOf(setId: string) {
  return sql<{ id: string, status: string }[]>`select id, status from reanalysis_runs where set_id = ${setId}`
}

async function waitFor(statusUrl: string, token: string) {
  for (let i = 0; i < 120; i++) {
    const reply = await api(statusUrl, { token })
    expect(reply.status).toBe(200)
    if (reply.body.status === 'done' || reply.body.status === 'failed') return reply.body
    await new Promise(r => setTimeout(r, 500))
  }
  throw new Error('the re-measurement did not finish within a minute')
}

beforeAll(async () => {
  owner = await newWorkshop('Reanalysis workshop')
  supervisor = (await memberWithRole(owner.token, 'supervisor')).token
  benchmaker = (await memberWithRole(owner.token, 'benchmaker')).token
  office = (await memberWithRole(owner.token, 'office')).token
  set = await createSet(owner.token, { fromNote: 'C4', toNote: 'E4' })
  const [p0, p1, p2] = set.pieces as [Piece, Piece, Piece]
  strikeIds.push([await strike(p0, [2, 0], 1), await strike(p0, [0.5, 0], 2)])
  strikeIds.push([await strike(p1, [0, 0], 3)])
  strikeIds.push([await strike(p2, [0, 0], 4)])
})

describe('re-measurement: who may, and whose', () => {
  it('refuses benchmaker and office (403) and queues nothing', async () => {
    for (const token of [benchmaker, office]) {
      expect((await api(`/api/sets/${set.id}/reanalyze`, { method: 'POST', token, body: {} })).status).toBe(403)
      expect((await api(`/api/pieces/${set.pieces[0]!.id}/reanalyze`, { method: 'POST', token, body: {} })).status).toBe(403)
    }
    expect(await runsOf(set.id)).toHaveLength(0)
  })

  it('answers 404 for another workshop\'s set, piece and run, and queues nothing', async () => {
    const other = await newWorkshop('Someone else')
    expect((await api(`/api/sets/${set.id}/reanalyze`, { method: 'POST', token: other.token, body: {} })).status).toBe(404)
    expect((await api(`/api/pieces/${set.pieces[0]!.id}/reanalyze`, { method: 'POST', token: other.token, body: {} })).status).toBe(404)
    expect(await runsOf(set.id)).toHaveLength(0)
    expect((await api(`/api/reanalysis?set=${set.id}`, { token: other.token })).status).toBe(404)
    expect((await api(`/api/reanalysis?piece=${set.pieces[0]!.id}`, { token: other.token })).status).toBe(404)
    const none = await api(`/api/reanalysis?set=${set.id}`, { token: owner.token })
    expect(none.status).toBe(200)
    expect(none.body).toEqual({ run: null })
  })

  it('answers 400 with a sentence for malformed requests', async () => {
    expect((await api('/api/sets/not-a-uuid/reanalyze', { method: 'POST', token: owner.token, body: {} })).status).toBe(400)
    const typed = await api(`/api/sets/${set.id}/reanalyze`, { method: 'POST', token: owner.token, body: { reason: 5 } })
    expect(typed.status).toBe(400)
    expect(typed.body.message).toMatch(/reason/)
    expect((await api(`/api/sets/${set.id}/reanalyze`, { method: 'POST', token: owner.token, body: { reason: 'x'.repeat(501) } })).status).toBe(400)
    expect((await api(`/api/sets/${set.id}/reanalyze`, { method: 'POST', token: owner.token, body: { everything: true } })).status).toBe(400)
    expect((await api('/api/reanalysis', { token: owner.token })).status).toBe(400)
    expect(await runsOf(set.id)).toHaveLength(0)
  })

  it('answers 409 for a piece that has no strike yet', async () => {
    const reply = await api(`/api/pieces/${set.pieces[4]!.id}/reanalyze`, { method: 'POST', token: supervisor, body: {} })
    expect(reply.status).toBe(409)
    expect(reply.body.message).toMatch(/nothing to re-measure/)
  })
})

describe('re-measuring a set', () => {
  let done: any

  it('lets one of racing requests through (202) and answers the others 409', async () => {
    await age(strikeIds[0]![1]!, set.pieces[0]!.id)
    // The third piece's recording has gone missing: its strike is reported, not fatal.
    const [key] = await sql<{ audio_key: string }[]>`select audio_key from strikes where id = ${strikeIds[2]![0]!}`
    await rm(join(process.env.NUXT_STORAGE_DIR!, key!.audio_key))
    const replies = await Promise.all([0, 1, 2].map(() => api(`/api/sets/${set.id}/reanalyze`, { method: 'POST', token: supervisor, body: { reason: 'engine update' } })))
    expect(replies.map(r => r.status).sort()).toEqual([202, 409, 409])
    const accepted = replies.find(r => r.status === 202)!.body
    expect(accepted).toMatchObject({ scope: 'set', setId: set.id, engineVersion: ENGINE_VERSION, statusUrl: `/api/reanalysis/${accepted.id}` })
    expect(['queued', 'running']).toContain(accepted.status)
    // A piece of the same set cannot start its own run meanwhile.
    const piece = await api(`/api/pieces/${set.pieces[1]!.id}/reanalyze`, { method: 'POST', token: owner.token, body: {} })
    expect(piece.status).toBe(409)
    done = await waitFor(accepted.statusUrl, supervisor)
    expect(done.status, done.error).toBe('done')
    expect(await runsOf(set.id)).toHaveLength(1)
  })

  it('shows, per strike, the old and new engine version, verdict and each partial\'s cents change', () => {
    const p0 = done.result.pieces.find((p: { pieceId: string }) => p.pieceId === set.pieces[0]!.id)
    expect(p0).toMatchObject({ signed: false, oldVerdict: 'outside', newVerdict: 'within', changed: true })
    const aged = p0.strikes.find((s: { strikeId: string }) => s.strikeId === strikeIds[0]![1])
    expect(aged).toMatchObject({ applied: true, error: null })
    expect(aged.change).toMatchObject({ oldEngineVersion: '0.9.0', newEngineVersion: ENGINE_VERSION, oldVerdict: 'outside', newVerdict: 'within', verdictChanged: true })
    // The aged reading was the new one plus 5 ¢ on the fundamental, so the change is −5 ¢.
    expect(aged.change.partials[0].changeCents).toBeCloseTo(-5, 6)
    const untouched = p0.strikes.find((s: { strikeId: string }) => s.strikeId === strikeIds[0]![0])
    expect(untouched.change.changed).toBe(false)
    const missing = done.result.pieces.find((p: { pieceId: string }) => p.pieceId === set.pieces[2]!.id).strikes[0]
    expect(missing).toMatchObject({ applied: false, change: null })
    expect(missing.error).toMatch(/missing from storage/)
  })

  it('keeps every old result and points the strike and the piece at the newest', async () => {
    const history = await sql<{ engine_version: string, reason: string, applied: boolean }[]>`
      select engine_version, reason, applied from strike_analyses where strike_id = ${strikeIds[0]![1]!} order by created_at`
    expect(history.map(h => h.reason)).toEqual(['recorded', 'reanalyze'])
    expect(history[1]).toMatchObject({ engine_version: ENGINE_VERSION, applied: true })
    const [s] = await sql<{ engine_version: string, verdict: string }[]>`select engine_version, verdict from strikes where id = ${strikeIds[0]![1]!}`
    expect(s).toEqual({ engine_version: ENGINE_VERSION, verdict: 'within' })
    const piece = await api(`/api/pieces/${set.pieces[0]!.id}`, { token: owner.token })
    expect(piece.body.latestVerdict).toBe('within')
    expect(piece.body.strikes[0].engineVersion).toBe(ENGINE_VERSION)
    // No history row for the strike whose recording was missing.
    const [{ n }] = await sql<{ n: number }[]>`select count(*)::int as n from strike_analyses where strike_id = ${strikeIds[2]![0]!} and reason = 'reanalyze'`
    expect(n).toBe(0)
    const audits = await sql<{ action: string }[]>`select action from audit_events where workshop_id = ${owner.workshopId} and action like 'reanalysis.%' or (workshop_id = ${owner.workshopId} and action = 'piece.reanalyze')`
    expect(audits.map(a => a.action)).toEqual(expect.arrayContaining(['reanalysis.request', 'reanalysis.done', 'piece.reanalyze']))
    const latest = await api(`/api/reanalysis?set=${set.id}`, { token: benchmaker })
    expect(latest.body.run.id).toBe(done.id)
    const listed = await api(`/api/strikes/${strikeIds[0]![1]}/analyses`, { token: office })
    expect(listed.status).toBe(200)
    expect(listed.body.map((h: { reason: string, engineVersion: string }) => `${h.reason} ${h.engineVersion}`)).toEqual([`recorded ${ENGINE_VERSION}`, `reanalyze ${ENGINE_VERSION}`])
    // Another workshop cannot read the run nor the history.
    const other = await newWorkshop('Curious neighbour')
    expect((await api(`/api/reanalysis/${done.id}`, { token: other.token })).status).toBe(404)
    expect((await api(`/api/strikes/${strikeIds[0]![1]}/analyses`, { token: other.token })).status).toBe(404)
  })
})

describe('re-measuring a signed piece', () => {
  it('records the new result in the history and shows it, but keeps the signed result and the stage', async () => {
    const piece = set.pieces[1]!
    expect((await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: owner.token, body: { to: 'review' } })).status).toBe(200)
    const approved = await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: supervisor, body: { strikeId: strikeIds[1]![0] } })
    expect(approved.status, JSON.stringify(approved.body)).toBe(200)
    await age(strikeIds[1]![0]!, piece.id)
    const started = await api(`/api/pieces/${piece.id}/reanalyze`, { method: 'POST', token: owner.token, body: {} })
    expect(started.status).toBe(202)
    const run = await waitFor(started.body.statusUrl, owner.token)
    expect(run.status).toBe('done')
    const entry = run.result.pieces[0]
    expect(entry).toMatchObject({ signed: true, stage: 'approved', oldVerdict: 'outside', newVerdict: 'within' })
    expect(entry.strikes[0]).toMatchObject({ applied: false, change: { oldEngineVersion: '0.9.0', newEngineVersion: ENGINE_VERSION, verdictChanged: true } })
    const after = await api(`/api/pieces/${piece.id}`, { token: owner.token })
    expect(after.body.stage).toBe('approved')
    expect(after.body.latestVerdict).toBe('outside')
    const [s] = await sql<{ engine_version: string }[]>`select engine_version from strikes where id = ${strikeIds[1]![0]!}`
    expect(s!.engine_version).toBe('0.9.0')
    const [h] = await sql<{ applied: boolean }[]>`select applied from strike_analyses where strike_id = ${strikeIds[1]![0]!} and run_id = ${run.id}`
    expect(h!.applied).toBe(false)
  })
})

describe('npm run reanalyze', () => {
  const run = promisify(execFile)
  const cli = (args: string[]) => run('npx', ['tsx', 'scripts/reanalyze.ts', ...args], { env: process.env, timeout: 120_000 })

  it('says plainly that an unknown serial is unknown, with a non-zero exit', async () => {
    const failed = await cli(['--set', 'NO-SUCH-SERIAL-42']).then(() => null, (e: { code: number, stderr: string }) => e)
    expect(failed).not.toBeNull()
    expect(failed!.code).not.toBe(0)
    expect(failed!.stderr.trim()).toBe('No set has the serial "NO-SUCH-SERIAL-42"; check the serial on the set\'s page.')
  })

  it('re-measures a set by its serial and prints a table of changes', async () => {
    await age(strikeIds[0]![0]!, set.pieces[0]!.id)
    const { stdout } = await cli(['--set', set.serial])
    expect(stdout).toMatch(/Engine\s+Verdict/)
    expect(stdout).toContain(`0.9.0 → ${ENGINE_VERSION}`)
    expect(stdout).toMatch(/Re-measured \d+ strikes of 3 pieces/)
    expect(stdout).toContain('missing from storage')
  })
})
