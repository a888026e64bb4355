import { describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop } from '../../../support/http'
import { testSql } from '../../../support/mail'

const URL = '/api/workshops/current/blank-thresholds'
// A stricter rosewood band than the starting one (17–22 E/ρ): a workshop's own choice, invented for the test.
const STRICT = { specificModulus: { select: 26, usable: 21 }, lossFactor: { select: 0.006, usable: 0.009 } }
// A rosewood-like blank. from memory: dense rosewoods are about 1000 kg/m³ with E near 20 GPa along the grain.
const BLANK = { lengthMm: 420, widthMm: 58, thicknessMm: 24, massG: 584.64, species: 'rosewood' }
const RHO = (BLANK.massG / 1000) / (0.42 * 0.058 * 0.024)
// source: f₁ = (4.7300² / 2π L²) √(E t² / 12 ρ), uniform free–free bar (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1)
const f1For = (eGPa: number) => (4.7300 ** 2 / (2 * Math.PI * 0.42 ** 2)) * Math.sqrt((eGPa * 1e9 * 0.024 ** 2) / (12 * RHO))

describe('blank thresholds per species', () => {
  it('starts with none of its own, and grading follows the owner\'s figures once stored (audited)', async () => {
    const owner = await newWorkshop('Threshold owner')
    const bench = await memberWithRole(owner.token, 'benchmaker')
    const first = await api(URL, { token: owner.token })
    expect(first.status).toBe(200)
    expect(first.body.thresholds).toEqual({})
    expect(first.body.starting.rosewood.specificModulus.usable).toBeGreaterThan(0)
    // E 20 GPa at ρ ≈ 1000 kg/m³ is E/ρ ≈ 20: usable by the starting rosewood band (17–22), a reject below the strict 21.
    const body = { ...BLANK, f1Hz: f1For(20), decayDbPerS: 20 }
    const before = await api('/api/blanks/grade', { method: 'POST', token: bench.token, body })
    expect(before.body.grade).toMatchObject({ rank: 'usable', source: 'starting' })

    const put = await api(URL, { method: 'PUT', token: owner.token, body: { thresholds: { rosewood: STRICT } } })
    expect(put.status).toBe(200)
    expect(put.body.thresholds).toEqual({ rosewood: STRICT })
    const after = await api('/api/blanks/grade', { method: 'POST', token: bench.token, body })
    expect(after.body.grade).toMatchObject({ rank: 'reject', source: 'workshop', thresholds: STRICT })
    const recorded = await api('/api/blanks', { method: 'POST', token: bench.token, body })
    expect(recorded.status).toBe(201)
    expect(recorded.body).toMatchObject({ rank: 'reject', grade: { source: 'workshop' } })
    // Another species still grades by the starting figures.
    const padauk = await api('/api/blanks/grade', { method: 'POST', token: bench.token, body: { ...body, species: 'padauk' } })
    expect(padauk.body.grade.source).toBe('starting')

    // Saving the same figures again writes no second audit row.
    await api(URL, { method: 'PUT', token: owner.token, body: { thresholds: { rosewood: STRICT } } })
    const [row] = await testSql()`select count(*)::int as n from audit_events where workshop_id = ${owner.workshopId} and action = 'workshop.blankThresholds'`
    expect(row!.n).toBe(1)
  })

  it('answers 401 without a session and 403 to every role but the owner, changing nothing', async () => {
    const owner = await newWorkshop('Threshold roles')
    expect((await api(URL, {})).status).toBe(401)
    expect((await api(URL, { method: 'PUT', body: { thresholds: {} } })).status).toBe(401)
    for (const role of ['supervisor', 'benchmaker', 'office']) {
      const member = await memberWithRole(owner.token, role)
      expect((await api(URL, { token: member.token })).status, role).toBe(403)
      expect((await api(URL, { method: 'PUT', token: member.token, body: { thresholds: { rosewood: STRICT } } })).status, role).toBe(403)
    }
    expect((await api(URL, { token: owner.token })).body.thresholds).toEqual({})
  })

  it('answers 400 with a plain sentence to malformed thresholds and keeps the old ones', async () => {
    const owner = await newWorkshop('Threshold checks')
    await api(URL, { method: 'PUT', token: owner.token, body: { thresholds: { padauk: { specificModulus: { select: 18, usable: 14 }, lossFactor: { select: 0.01, usable: 0.015 } } } } })
    const bad: [unknown, RegExp][] = [
      [{ thresholds: { rosewood: { ...STRICT, specificModulus: { select: 20, usable: 21 } } } }, /select E\/ρ must be at least the usable/],
      [{ thresholds: { rosewood: { ...STRICT, lossFactor: { select: 0.01, usable: 0.009 } } } }, /select loss factor must be at most the usable/],
      [{ thresholds: { rosewood: { ...STRICT, lossFactor: { select: 0, usable: 0.009 } } } }, /above 0/],
      [{ thresholds: { rosewood: { ...STRICT, specificModulus: { select: -3, usable: -5 } } } }, /above 0/],
      [{ thresholds: { rosewood: { ...STRICT, specificModulus: { select: 'stiff', usable: 21 } } } }, /number/],
      [{ thresholds: { cheese: STRICT } }, /cheese/],
      [{ thresholds: { rosewood: { specificModulus: STRICT.specificModulus } } }, /loss factor/],
      [{ thresholds: [] }, /per species/],
      [{}, /Send the thresholds per species/],
      [{ thresholds: {}, extra: 1 }, /extra/],
    ]
    for (const [body, message] of bad) {
      const reply = await api(URL, { method: 'PUT', token: owner.token, body })
      expect(reply.status, JSON.stringify(body)).toBe(400)
      expect(reply.body.message, JSON.stringify(body)).toMatch(message)
    }
    expect(Object.keys((await api(URL, { token: owner.token })).body.thresholds)).toEqual(['padauk'])
  })

  it('keeps each workshop\'s thresholds to itself', async () => {
    const mine = await newWorkshop('Thresholds mine')
    const theirs = await newWorkshop('Thresholds theirs')
    await api(URL, { method: 'PUT', token: mine.token, body: { thresholds: { rosewood: STRICT } } })
    expect((await api(URL, { token: theirs.token })).body.thresholds).toEqual({})
    // Asking for the other workshop by header is a 404, as for any workshop the user is not in.
    expect((await api(URL, { token: theirs.token, headers: { 'x-workshop-id': mine.workshopId } })).status).toBe(404)
    const bench = await memberWithRole(theirs.token, 'benchmaker')
    const graded = await api('/api/blanks/grade', { method: 'POST', token: bench.token, body: { ...BLANK, f1Hz: f1For(20) } })
    expect(graded.body.grade.source).toBe('starting')
  })

  it('takes racing saves one after the other (one of them wins whole) and refuses an oversized body with 413', async () => {
    const owner = await newWorkshop('Threshold races')
    const LOOSE = { specificModulus: { select: 20, usable: 15 }, lossFactor: { select: 0.01, usable: 0.02 } }
    const replies = await Promise.all([STRICT, LOOSE, STRICT, LOOSE].map(rosewood => api(URL, { method: 'PUT', token: owner.token, body: { thresholds: { rosewood } } })))
    expect(replies.map(r => r.status)).toEqual([200, 200, 200, 200])
    const stored = (await api(URL, { token: owner.token })).body.thresholds.rosewood
    expect([STRICT, LOOSE]).toContainEqual(stored)
    // The JSON body limit is 1 MB (server/utils/request-limits.ts).
    const huge = await api(URL, { method: 'PUT', token: owner.token, body: { thresholds: { rosewood: STRICT }, padding: 'x'.repeat(1_100_000) } })
    expect(huge.status).toBe(413)
    expect((await api(URL, { token: owner.token })).body.thresholds.rosewood).toEqual(stored)
  })
})
