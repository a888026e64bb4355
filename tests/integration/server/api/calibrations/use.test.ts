import postgres from 'postgres'
import { afterAll, describe, expect, it } from 'vitest'
import { centsBetween } from '../../../../../shared/analysis/centsBetween'
import { encodeWav } from '../../../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../../../shared/synthesis/synthStrike'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { createSet, postStrike } from '../../../support/records'

const sql = postgres(process.env.NUXT_DATABASE_URL!, { max: 1, onnotice: () => {} })
afterAll(() => sql.end())

function form(bytes: Uint8Array, fields: Record<string, string>) {
  const f = new FormData()
  f.set('file', new Blob([bytes], { type: 'audio/wav' }), 'take.wav')
  for (const [k, v] of Object.entries(fields)) f.set(k, v)
  return f
}

/** A strike of a bar at `hz` (fundamental and double octave) recorded by an input reading `ppm` high. */
function strikeRead(hz: number, ppm: number) {
  const k = 1 + ppm * 1e-6
  return encodeWav(synthStrike([
    { frequencyHz: hz * k, amplitudeDb: -6, decayDbPerS: 6 },
    { frequencyHz: hz * 4 * k, amplitudeDb: -14, decayDbPerS: 12 },
  ], { sampleRate: 48000, durationS: 3, onsetS: 0.1, noiseDb: -70, seed: 3 }), 48000)
}

/** A calibration row as the route stores it, measured `daysAgo` days ago (no tone needed for these checks). */
async function storedCalibration(workshopId: string, offsetPpm: number, daysAgo = 1, device = 'Bench interface, input 1') {
  const [row] = await sql`insert into calibrations (workshop_id, device, reference_hz, reference_uncertainty_ppm, measured_hz, offset_ppm, uncertainty_ppm, created_at)
    values (${workshopId}, ${device}, 1000, 0.5, ${1000 * (1 + offsetPpm * 1e-6)}, ${offsetPpm}, 0.6, now() - make_interval(days => ${daysAgo})) returning id`
  return row!.id as string
}

const A4 = { 'note': 'A4', 'ratios': '1,4', 'tolerances': '0.3,10', 'reference-hz': '440' }

describe('calibration-id on POST /api/analyze', () => {
  it('corrects a 440 Hz strike read 300 ppm high to 440 Hz within 0.05 ¢, end to end from the reference tone', async () => {
    const { token } = await newWorkshop('Calibrated analysis')
    // The checks of issue 15: a 1000 Hz tone labelled 1000 Hz arriving 300 ppm high, then a strike through the same input.
    const tone = encodeWav(synthStrike([{ frequencyHz: 1000 * (1 + 300e-6), amplitudeDb: -6, decayDbPerS: 0 }], { sampleRate: 48000, durationS: 6, noiseDb: -40, seed: 9 }), 48000)
    const calibration = await api('/api/calibrations', { method: 'POST', token, body: form(tone, { referenceHz: '1000', device: 'Bench interface, input 1' }) })
    expect(calibration.status).toBe(201)
    const uncorrected = await api('/api/analyze', { method: 'POST', token, body: form(strikeRead(440, 300), A4) })
    expect(uncorrected.body.matches[0].cents).toBeGreaterThan(0.4) // 300 ppm ≈ 0.519 ¢, 1200·log2(1.0003) (definition of the cent)
    expect(uncorrected.body.calibration).toBeUndefined()
    const reply = await api('/api/analyze', { method: 'POST', token, body: form(strikeRead(440, 300), { ...A4, 'calibration-id': calibration.body.id }) })
    expect(reply.status).toBe(200)
    expect(Math.abs(centsBetween(reply.body.fundamentalHz, 440))).toBeLessThan(0.05)
    expect(Math.abs(reply.body.matches[0].cents)).toBeLessThan(0.05)
    expect(reply.body.matches[0].within).toBe(true)
    expect(reply.body.calibration).toMatchObject({ id: calibration.body.id, device: 'Bench interface, input 1', offsetPpm: calibration.body.offsetPpm, uncertaintyPpm: calibration.body.uncertaintyPpm })
    expect(Date.parse(reply.body.calibration.measuredAt)).toBeGreaterThan(Date.now() - 600_000)
    expect(reply.body.calibrationExpired).toBe(false)
    expect(reply.body.parameters.clockOffsetPpm).toBe(calibration.body.offsetPpm)
    const fundamental = reply.body.partials.find((p: { frequencyHz: number }) => Math.abs(p.frequencyHz - 440) < 1)
    expect(fundamental.rawFrequencyHz).toBeCloseTo(440 * 1.0003, 2)
  })

  it('refuses another workshop\'s calibration with 404 and a malformed id with 400, before measuring', async () => {
    const mine = await newWorkshop('Calibration owner')
    const theirs = await newWorkshop('Calibration stranger')
    const id = await storedCalibration(mine.workshopId, 300)
    const foreign = await api('/api/analyze', { method: 'POST', token: theirs.token, body: form(strikeRead(440, 0), { ...A4, 'calibration-id': id }) })
    expect(foreign.status).toBe(404)
    expect(foreign.body.message).toBe('No such calibration in this workshop.')
    // Checked before the engine: the same refusal for bytes that are not audio at all.
    expect((await api('/api/analyze', { method: 'POST', token: theirs.token, body: form(new TextEncoder().encode('no sound'), { 'calibration-id': id }) })).status).toBe(404)
    for (const bad of ['12', 'not-a-uuid', `${id}x`, '\'; drop table calibrations; --']) {
      const reply = await api('/api/analyze', { method: 'POST', token: mine.token, body: form(strikeRead(440, 0), { ...A4, 'calibration-id': bad }) })
      expect(reply.status, bad).toBe(400)
      expect(reply.body.message).toMatch(/That is not a valid calibration id\.$/)
    }
    const smuggled = await api('/api/analyze', { method: 'POST', token: mine.token, body: form(strikeRead(440, 0), { ...A4, 'clock-offset-ppm': '300' }) })
    expect(smuggled.status).toBe(400)
    expect(smuggled.body.message).toMatch(/calibration-id/)
  })

  it('still corrects with an expired calibration and says it has expired', async () => {
    const { token, workshopId } = await newWorkshop('Expired calibration')
    const id = await storedCalibration(workshopId, 300, 91) // the default interval is 90 days
    const reply = await api('/api/analyze', { method: 'POST', token, body: form(strikeRead(440, 300), { ...A4, 'calibration-id': id }) })
    expect(reply.status).toBe(200)
    expect(reply.body.calibrationExpired).toBe(true)
    expect(Math.abs(reply.body.matches[0].cents)).toBeLessThan(0.05)
  })
})

describe('calibration-id on POST /api/pieces/:id/strikes', () => {
  it('lets a benchmaker strike under the workshop\'s calibration and stores its id and the raw frequencies', async () => {
    const owner = await newWorkshop('Calibrated strikes')
    const bench = await memberWithRole(owner.token, 'benchmaker')
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const piece = set.pieces[0] as { id: string }
    const id = await storedCalibration(owner.workshopId, 300)
    const reply = await postStrike(bench.token, piece.id, strikeRead(440, 300), { 'calibration-id': id, 'temperatureC': '' })
    expect(reply.status).toBe(201)
    expect(reply.body.calibrationId).toBe(id)
    expect(reply.body.calibration).toMatchObject({ id, offsetPpm: 300, uncertaintyPpm: 0.6 })
    expect(reply.body.calibrationExpired).toBe(false)
    expect(Math.abs(centsBetween(reply.body.fundamentalHz, 440))).toBeLessThan(0.05)
    const [row] = await sql`select calibration_id, analysis from strikes where id = ${reply.body.id}`
    expect(row!.calibration_id).toBe(id)
    expect(row!.analysis.parameters.clockOffsetPpm).toBe(300)
    expect(row!.analysis.partials.some((p: { rawFrequencyHz?: number }) => Math.abs((p.rawFrequencyHz ?? 0) - 440.132) < 0.01)).toBe(true)
    // Without the field a strike is uncorrected and names no calibration.
    const plain = await postStrike(bench.token, piece.id, strikeRead(440, 300))
    expect(plain.status).toBe(201)
    expect(plain.body.calibrationId).toBeNull()
    expect(plain.body.calibration).toBeNull()
    expect(centsBetween(plain.body.fundamentalHz, 440)).toBeGreaterThan(0.4)
  })

  it('stores nothing for another workshop\'s calibration (404) or a malformed id (400)', async () => {
    const owner = await newWorkshop('Strike workshop')
    const stranger = await newWorkshop('Other workshop')
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const piece = set.pieces[0] as { id: string }
    const foreign = await storedCalibration(stranger.workshopId, 120)
    const refused = await postStrike(owner.token, piece.id, strikeRead(440, 0), { 'calibration-id': foreign })
    expect(refused.status).toBe(404)
    expect(refused.body.message).toBe('No such calibration in this workshop.')
    expect((await postStrike(owner.token, piece.id, strikeRead(440, 0), { 'calibration-id': 'input-1' })).status).toBe(400)
    const [count] = await sql`select count(*)::int as n from strikes where piece_id = ${piece.id}`
    expect(count!.n).toBe(0)
    const [pieceRow] = await sql`select strike_count, stage from pieces where id = ${piece.id}`
    expect(pieceRow!.strike_count).toBe(0)
  })

  it('answers an expired calibration with the flag, under a workshop interval of 7 days', async () => {
    const owner = await newWorkshop('Short interval')
    expect((await api('/api/workshops/current/settings', { method: 'PATCH', token: owner.token, body: { calibrationValidDays: 7 } })).status).toBe(200)
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const id = await storedCalibration(owner.workshopId, -80, 8)
    const reply = await postStrike(owner.token, set.pieces[0].id, strikeRead(440, -80), { 'calibration-id': id })
    expect(reply.status).toBe(201)
    expect(reply.body.calibrationExpired).toBe(true)
    expect(Math.abs(centsBetween(reply.body.fundamentalHz, 440))).toBeLessThan(0.05)
  })

  it('re-measures a calibrated strike under the same calibration', async () => {
    const owner = await newWorkshop('Re-measured calibration')
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const piece = set.pieces[0] as { id: string }
    const id = await storedCalibration(owner.workshopId, 300)
    const strike = await postStrike(owner.token, piece.id, strikeRead(440, 300), { 'calibration-id': id })
    expect(strike.status).toBe(201)
    const run = await api(`/api/pieces/${piece.id}/reanalyze`, { method: 'POST', token: owner.token, body: {} })
    expect(run.status).toBe(202)
    let status = run.body.status as string
    for (let i = 0; i < 180 && status !== 'done' && status !== 'failed'; i++) {
      await new Promise(r => setTimeout(r, 500))
      status = (await api(run.body.statusUrl, { token: owner.token })).body.status
    }
    expect(status).toBe('done')
    const rows = await sql`select reason, analysis -> 'parameters' ->> 'clockOffsetPpm' as offset, (analysis ->> 'fundamentalHz')::float8 as hz from strike_analyses where strike_id = ${strike.body.id} order by created_at`
    expect(rows.map(r => r.reason)).toEqual(['recorded', 'reanalyze'])
    expect(rows.map(r => Number(r.offset))).toEqual([300, 300])
    expect(Math.abs(centsBetween(rows[1]!.hz, 440))).toBeLessThan(0.05)
  })
})
