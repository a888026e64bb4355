import { beforeAll, describe, expect, it } from 'vitest'
import { benchMembers } from '../../../support/bench-members'
import { api, BASE_URL } from '../../../support/http'

// A uniform rosewood-like bar, about F5 in size. from memory: dense rosewoods are about 1000 kg/m³ with E near 20 GPa along the grain.
const BAR = { lengthMm: 380, widthMm: 55, profile: [{ xMm: 0, thicknessMm: 22 }, { xMm: 380, thicknessMm: 22 }], densityKgM3: 1000, youngsModulusGPa: 20 }
// Fundamental 10 ¢ sharp, second partial on target; tolerances 3 ¢ and 5 ¢. source: common practice (the starter marimba template)
const SHARP = { ...BAR, partials: [{ ratio: 1, cents: 10, toleranceCents: 3 }, { ratio: 4, cents: 0, toleranceCents: 5 }] }

let owner = ''
let benchmaker = ''
let office = ''

beforeAll(async () => {
  ({ owner, benchmaker, office } = await benchMembers('Cut plan workshop'))
})

const plan = (body: unknown, token = benchmaker) => api('/api/cut-plan', { method: 'POST', token, body })

describe('POST /api/cut-plan', () => {
  it('plans cuts near the centre only for a bar whose fundamental is 10 ¢ sharp, and the model agrees after them', async () => {
    const reply = await plan(SHARP)
    expect(reply.status).toBe(200)
    const { modesHz, stations, predicted, feasible } = reply.body
    expect(feasible).toBe(true)
    expect(modesHz).toHaveLength(4)
    // source: f₁ = (4.7300² / 2π L²) √(E h² / 12 ρ) for a uniform free–free bar (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1)
    const f1 = (4.7300 ** 2 / (2 * Math.PI * 0.38 ** 2)) * Math.sqrt((20e9 * 0.022 ** 2) / (12 * 1000))
    expect(Math.abs(modesHz[0] / f1 - 1)).toBeLessThan(0.0005)
    const cuts = stations.filter((s: { depthMm: number }) => s.depthMm > 0)
    expect(cuts.length).toBeGreaterThan(0)
    for (const c of cuts) expect(Math.abs(c.xMm - 190)).toBeLessThanOrEqual(0.15 * 380)
    expect(Math.abs(predicted[0].centsAfter)).toBeLessThanOrEqual(3)
    expect(Math.abs(predicted[1].centsAfter)).toBeLessThanOrEqual(5)

    // The depth is linear between the plan's stations, as the thickness is between profile stations.
    const cutProfile = stations.map((s: { xMm: number, depthMm: number }) => ({ xMm: s.xMm, thicknessMm: 22 - s.depthMm }))
    const again = await plan({ ...SHARP, profile: cutProfile })
    expect(again.status).toBe(200)
    const moved = 1200 * Math.log2(again.body.modesHz[0] / modesHz[0])
    const expected = predicted[0].centsAfter - predicted[0].centsBefore
    // source: the acceptance bound, 5 %
    expect(Math.abs(moved / expected - 1)).toBeLessThan(0.05)
  })

  it('answers feasible: false with a plain note when the limits leave no plan', async () => {
    const reply = await plan({ ...BAR, partials: [{ ratio: 1, cents: -10, toleranceCents: 3 }], minThicknessMm: 21.9 })
    expect(reply.status).toBe(200)
    expect(reply.body.feasible).toBe(false)
    expect(reply.body.note).toMatch(/^No plan .*\.$/)
  })

  it('answers 401 without a session and 403 to a role that may not strike', async () => {
    expect((await api('/api/cut-plan', { method: 'POST', body: SHARP })).status).toBe(401)
    const refused = await plan(SHARP, office)
    expect(refused.status).toBe(403)
    expect((await plan(SHARP, owner)).status).toBe(200)
  })

  const BAD: [string, unknown, RegExp][] = [
    ['no body fields', {}, /length/i],
    ['a string for a number', { ...SHARP, lengthMm: '380' }, /length/i],
    ['an absurd length', { ...SHARP, lengthMm: 1e9 }, /length must be between/i],
    ['a negative thickness', { ...SHARP, profile: [{ xMm: 0, thicknessMm: -1 }, { xMm: 380, thicknessMm: 22 }] }, /thickness/i],
    ['a profile that stops short', { ...SHARP, profile: [{ xMm: 0, thicknessMm: 22 }, { xMm: 300, thicknessMm: 22 }] }, /end at the bar's length/],
    ['stations out of order', { ...SHARP, profile: [{ xMm: 0, thicknessMm: 22 }, { xMm: 200, thicknessMm: 20 }, { xMm: 100, thicknessMm: 20 }, { xMm: 380, thicknessMm: 22 }] }, /left to right/],
    ['too many stations', { ...SHARP, profile: Array.from({ length: 65 }, (_, i) => ({ xMm: (380 * i) / 64, thicknessMm: 22 })) }, /at most 64/],
    ['too many partials', { ...SHARP, partials: [1, 2, 3, 4, 5].map(ratio => ({ ratio, cents: 0, toleranceCents: 3 })) }, /at most 4/i],
    ['no partials', { ...SHARP, partials: [] }, /at least one partial/],
    ['a zero tolerance', { ...SHARP, partials: [{ ratio: 1, cents: 10, toleranceCents: 0 }] }, /tolerance/i],
    ['an unknown field', { ...SHARP, elements: 100000 }, /unrecognized|elements/i],
    ['an array body', [SHARP], /expected object|object/i],
  ]
  for (const [what, body, sentence] of BAD) {
    it(`answers 400 with a plain sentence for ${what}`, async () => {
      const reply = await plan(body)
      expect(reply.status).toBe(400)
      expect(reply.body.message).toMatch(sentence)
      expect(JSON.stringify(reply.body)).not.toMatch(/\bat .*\.(ts|mjs|js):\d+/)
    })
  }

  it('answers 400, not 500, for a body that is not JSON, and 413 for one past the size limit', async () => {
    const raw = await fetch(`${BASE_URL}/api/cut-plan`, { method: 'POST', headers: { 'content-type': 'application/json', 'authorization': `Bearer ${benchmaker}` }, body: '{"lengthMm": 380,' })
    expect(raw.status).toBe(400)
    const big = await plan({ ...SHARP, padding: 'x'.repeat(1_100_000) })
    expect(big.status).toBe(413)
  })

  it('answers every one of several plans asked at once, none with 500', async () => {
    const replies = await Promise.all(Array.from({ length: 6 }, (_, i) => plan({ ...SHARP, partials: [{ ratio: 1, cents: 4 + i, toleranceCents: 3 }] })))
    for (const r of replies) expect([200, 503]).toContain(r.status)
    expect(replies.filter(r => r.status === 200).length).toBeGreaterThan(0)
  })
})
