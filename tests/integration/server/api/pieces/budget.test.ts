import { execFileSync } from 'node:child_process'
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../../../support/http'
import { approvedSet, finishApprovals } from '../../../support/certified-set'
import { waitForPdf } from '../../../support/certificates'
import { testSql } from '../../../support/mail'
import { postStrike, strikeWav } from '../../../support/records'

type Ctx = Awaited<ReturnType<typeof approvedSet>>
let ctx: Ctx
let piece: { id: string, targetHz: number }
const OUT = join('test-results', 'budget')
const strikeIds: string[] = []

// A bar tuned a little sharp on each strike (1 : 4), so repeatability has a spread to read.
async function strike(seed: number, cents: number) {
  const reply = await postStrike(ctx.bench.token, piece.id, strikeWav(piece.targetHz, [1, 4], [cents, cents], seed), { temperatureC: '21.0' })
  expect(reply.status, JSON.stringify(reply.body)).toBe(201)
  strikeIds.push(reply.body.id ?? reply.body.strike?.id)
}

describe('a piece\'s uncertainty budget, three strikes before review and the certificate annex', () => {
  beforeAll(async () => {
    mkdirSync(OUT, { recursive: true })
    ctx = await approvedSet({ from: 'C6', to: 'C6' })
    piece = ctx.set.pieces[0]
  })
  afterAll(async () => {
    await testSql().end()
  })

  it('answers no budget before the first strike, and refuses strangers, other workshops and malformed ids', async () => {
    for (const route of ['budget', 'review-readiness']) {
      const url = `/api/pieces/${piece.id}/${route}`
      expect((await api(url, { token: ctx.bench.token })).status, route).toBe(200)
      expect((await api(url)).status, route).toBe(401)
      const other = await newWorkshop('Another bar works')
      const foreign = await api(url, { token: other.token })
      expect(foreign.status, route).toBe(404)
      expect(JSON.stringify(foreign.body)).toMatch(/No such piece/)
      expect((await api(`/api/pieces/not-a-uuid/${route}`, { token: ctx.bench.token })).status, route).toBe(400)
    }
    expect((await api(`/api/pieces/${piece.id}/budget`, { token: ctx.bench.token })).body).toEqual({ budget: null })
  })

  it('asks for three strikes of the final form before review when the workshop turns it on, and moves nothing until then', async () => {
    const on = await api('/api/workshops/current/settings', { method: 'PATCH', token: ctx.owner.token, body: { repeatStrikesBeforeReview: true } })
    expect(on.status).toBe(200)
    await strike(11, 0.6)
    const readiness = await api(`/api/pieces/${piece.id}/review-readiness`, { token: ctx.bench.token })
    expect(readiness.body).toEqual({ needed: 3, atFinalState: 1, missing: 2, advice: 'strike twice more before review' })
    const before = (await api(`/api/pieces/${piece.id}`, { token: ctx.bench.token })).body.stage
    const refused = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: ctx.bench.token, body: { to: 'review', via: before === 'tuning' ? undefined : 'tuning' } })
    expect(refused.status).toBe(409)
    expect(JSON.stringify(refused.body)).toMatch(/strike twice more before review/)
    expect((await api(`/api/pieces/${piece.id}`, { token: ctx.bench.token })).body.stage).toBe(before)
    await strike(12, 0.9)
    await strike(13, 0.3)
    expect((await api(`/api/pieces/${piece.id}/review-readiness`, { token: ctx.bench.token })).body).toMatchObject({ atFinalState: 3, missing: 0, advice: null })
  }, 180_000)

  it('budgets each partial from the strikes, the input calibration and its drift history, and says what is not assessed', async () => {
    // Calibrations are stored by another route; here they are written directly so the clock is known exactly.
    const sql = testSql()
    const [older] = await sql`insert into calibrations (workshop_id, device, reference_hz, measured_hz, offset_ppm, uncertainty_ppm, created_at)
      values (${ctx.owner.workshopId}, 'Bench interface A', 1000, 1000.04, 40, 0.3, now() - interval '40 days') returning id`
    const [newer] = await sql`insert into calibrations (workshop_id, device, reference_hz, measured_hz, offset_ppm, uncertainty_ppm, reference_uncertainty_ppm, created_at)
      values (${ctx.owner.workshopId}, 'Bench interface A', 1000, 1000.044, 44, 0.5, 0.1, now() - interval '20 days') returning id`
    expect(older).toBeDefined()
    await sql`update strikes set calibration_id = ${newer!.id} where piece_id = ${piece.id}`
    const { budget } = (await api(`/api/pieces/${piece.id}/budget`, { token: ctx.bench.token })).body
    expect(budget.strikeId).toBe(strikeIds[2])
    const b = budget.budget
    expect(b.rule).toBe('simple')
    expect(b.strikeCount).toBe(3)
    expect(b.clock).toMatchObject({ state: 'calibrated', device: 'Bench interface A', offsetPpm: 44, uncertaintyPpm: 0.5, expired: false })
    // Drift: (44 − 40) ppm over 20 days = 0.2 ppm/day, times the 20 days since the newer calibration = 4 ppm (least squares of two points, from memory).
    expect(b.clock.driftPpm).toBeCloseTo(4, 1)
    const fundamental = b.partials[0]
    expect(fundamental.budget.lines.map((l: { name: string }) => l.name)).toEqual(['repeatability', 'estimator', 'clock calibration', 'clock drift since calibration', 'bench temperature', 'resolution'])
    // U = 2u (JCGM 100:2008 §6.2.1, k = 2), u the root sum of squares of the contributions (§5.1.2).
    const u = Math.sqrt(fundamental.budget.lines.reduce((s: number, l: { contribution: number }) => s + l.contribution ** 2, 0))
    expect(fundamental.budget.expandedUncertainty).toBeCloseTo(2 * u, 9)
    // A calibration older than the workshop's interval is expired at the strike.
    await sql`update workshops set calibration_valid_days = 5 where id = ${ctx.owner.workshopId}`
    expect((await api(`/api/pieces/${piece.id}/budget`, { token: ctx.bench.token })).body.budget.budget.clock.expired).toBe(true)
  })

  it('lets an owner choose guarded acceptance as a new template version, and refuses a rule it does not know', async () => {
    const current = (await api(`/api/templates/${ctx.template.id}`, { token: ctx.owner.token })).body.current
    const body = { family: current.family, name: current.name, partials: current.partials, searchWindowCents: current.searchWindowCents, referenceTemperatureC: current.referenceTemperatureC, temperatureCoefficientCentsPerC: current.temperatureCoefficientCentsPerC }
    const bad = await api(`/api/templates/${ctx.template.id}`, { method: 'PUT', token: ctx.owner.token, body: { ...body, decisionRule: 'lenient' } })
    expect(bad.status).toBe(400)
    expect(JSON.stringify(bad.body)).toMatch(/decision rule/i)
    expect((await api(`/api/templates/${ctx.template.id}`, { method: 'PUT', token: ctx.bench.token, body: { ...body, decisionRule: 'guarded' } })).status).toBe(403)
    const saved = await api(`/api/templates/${ctx.template.id}`, { method: 'PUT', token: ctx.owner.token, body: { ...body, decisionRule: 'guarded' } })
    expect(saved.status).toBe(200)
    const after = (await api(`/api/templates/${ctx.template.id}`, { token: ctx.owner.token })).body
    expect(after.current).toMatchObject({ version: current.version + 1, decisionRule: 'guarded' })
    expect(after.versions.find((v: { version: number }) => v.version === current.version).decisionRule).toBe('simple')
  })

  it('freezes the budget with the certificate: the PDF lists the calibration, the decision rule and the annex', async () => {
    const sql = testSql()
    // The piece was measured against the guarded version of its template from here on.
    const [guarded] = await sql`select id from template_versions where template_id = ${ctx.template.id} and decision_rule = 'guarded'`
    await sql`update pieces set template_version_id = ${guarded!.id} where id = ${piece.id}`
    const stage = (await api(`/api/pieces/${piece.id}`, { token: ctx.bench.token })).body.stage
    const moved = await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: ctx.bench.token, body: { to: 'review', via: stage === 'tuning' ? undefined : 'tuning' } })
    expect(moved.status, JSON.stringify(moved.body)).toBe(200)
    const approved = await api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: ctx.supervisor.token, body: { strikeId: strikeIds[2] } })
    expect(approved.status, JSON.stringify(approved.body)).toBe(200)
    await finishApprovals(ctx.set.id)
    const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })
    expect(signed.status, JSON.stringify(signed.body)).toBe(201)
    const file = join(OUT, 'certificate-with-budget.pdf')
    writeFileSync(file, await waitForPdf(ctx.office.token, signed.body.id, '', 90_000))
    const text = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ')
    expect(text).toContain('Decision rule: guarded acceptance')
    expect(text).toMatch(/Input calibration Bench interface A, calibrated \d{4}-\d{2}-\d{2}: offset \+44\.00 ppm ± 0\.50 ppm/)
    expect(text).toContain('EXPIRED when the strikes were made')
    expect(text).toContain('Annex: uncertainty budgets')
    expect(text).toMatch(/clock drift since calibration/)
    expect(text).toContain('not an accredited calibration laboratory')
    expect(text).toMatch(/± \d\.\d+ ¢/)
    // A later calibration or setting changes neither the frozen content nor its verification.
    await sql`update workshops set calibration_valid_days = 365 where id = ${ctx.owner.workshopId}`
    const verified = await api(`/api/verify/${signed.body.code}`)
    expect(verified.body.hashMatches).toBe(true)
    // The public check shows ± U beside each deviation, as the PDF does.
    expect(verified.body.pieces[0].partials[0].expandedUncertaintyCents).toBeGreaterThan(0)
    const [row] = await sql`select content from certificates where id = ${signed.body.id}`
    expect(row!.content.calibrations[0]).toMatchObject({ device: 'Bench interface A', expired: true })
    expect(row!.content.pieces[0].budget[0].lines.length).toBeGreaterThanOrEqual(5)
  }, 180_000)
})
