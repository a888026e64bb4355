import { beforeAll, describe, expect, it } from 'vitest'
import { benchMembers } from '../../../support/bench-members'
import { api, BASE_URL } from '../../../support/http'

// A rosewood-like blank. from memory: dense rosewoods are about 1000 kg/m³ with E near 20 GPa along the grain.
const E_GPA = 20
const BLANK = { lengthMm: 420, widthMm: 58, thicknessMm: 24, massG: 584.64 }
const RHO = (BLANK.massG / 1000) / (0.42 * 0.058 * 0.024)
// source: f₁ = (4.7300² / 2π L²) √(E t² / 12 ρ), uniform free–free bar (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1)
const F1 = (4.7300 ** 2 / (2 * Math.PI * 0.42 ** 2)) * Math.sqrt((E_GPA * 1e9 * 0.024 ** 2) / (12 * RHO))

let benchmaker = ''
let office = ''

beforeAll(async () => {
  ({ benchmaker, office } = await benchMembers('Blank grading workshop'))
})

const grade = (body: unknown, token = benchmaker) => api('/api/blanks/grade', { method: 'POST', token, body })

describe('POST /api/blanks/grade', () => {
  it('gets E back within 0.5 % from the first mode a known blank would ring at', async () => {
    const reply = await grade({ ...BLANK, f1Hz: F1, decayDbPerS: 35 })
    expect(reply.status).toBe(200)
    const body = reply.body
    expect(Object.keys(body).sort()).toEqual(['densityKgM3', 'grade', 'lossFactor', 'specificModulus', 'youngsModulusGPa', 'youngsModulusTimoshenkoGPa'])
    expect(Math.abs(body.youngsModulusGPa / E_GPA - 1)).toBeLessThan(0.005)
    expect(body.densityKgM3).toBeCloseTo(RHO, 6)
    expect(body.youngsModulusTimoshenkoGPa).toBeGreaterThan(body.youngsModulusGPa)
    // source: η = D / (27.29 f) (Cremer & Heckl, Structure-Borne Sound)
    expect(body.lossFactor).toBeCloseTo(35 / (27.29 * F1), 5)
    expect(body.grade).toBeNull()
  })

  it('answers lossFactor null without a decay', async () => {
    const reply = await grade({ ...BLANK, f1Hz: F1 })
    expect(reply.status).toBe(200)
    expect(reply.body.lossFactor).toBeNull()
  })

  it('answers 401 without a session and 403 to a role that may not strike', async () => {
    expect((await api('/api/blanks/grade', { method: 'POST', body: { ...BLANK, f1Hz: F1 } })).status).toBe(401)
    expect((await grade({ ...BLANK, f1Hz: F1 }, office)).status).toBe(403)
  })

  const BAD: [string, unknown, RegExp][] = [
    ['no frequency', BLANK, /f1Hz/],
    ['a zero mass', { ...BLANK, massG: 0, f1Hz: F1 }, /mass must be between/i],
    ['a negative decay', { ...BLANK, f1Hz: F1, decayDbPerS: -3 }, /decay rate must be between/i],
    ['a mass no blank of that size has', { ...BLANK, massG: 90_000, f1Hz: F1 }, /kg\/m³, which no blank is/],
    ['a string for the frequency', { ...BLANK, f1Hz: 'loud' }, /f1Hz/],
    ['an unknown field', { ...BLANK, f1Hz: F1, species: 'x' }, /unrecognized|species/i],
  ]
  for (const [what, body, sentence] of BAD) {
    it(`answers 400 with a plain sentence for ${what}`, async () => {
      const reply = await grade(body)
      expect(reply.status).toBe(400)
      expect(reply.body.message).toMatch(sentence)
    })
  }

  it('checks a strike upload\'s figures before measuring it (400 with a sentence, never 500)', async () => {
    const form = new FormData()
    form.set('file', new Blob([new Uint8Array(64)], { type: 'audio/wav' }), 'blank.wav')
    const reply = await api('/api/blanks/grade', { method: 'POST', token: benchmaker, body: form })
    expect(reply.status).toBe(400)
    expect(reply.body.message).toMatch(/^lengthMm: Enter the length\.$/)
  })

  it('answers 415 for a body that is neither JSON nor a multipart form', async () => {
    const reply = await fetch(`${BASE_URL}/api/blanks/grade`, { method: 'POST', headers: { 'content-type': 'text/plain', 'authorization': `Bearer ${benchmaker}` }, body: 'f1Hz=600' })
    expect(reply.status).toBe(415)
  })
})
