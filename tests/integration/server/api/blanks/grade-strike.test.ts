import { beforeAll, describe, expect, it } from 'vitest'
import { encodeWav } from '../../../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../../../shared/synthesis/synthStrike'
import { benchMembers } from '../../../support/bench-members'
import { api } from '../../../support/http'

// A rosewood-like blank. from memory: dense rosewoods are about 1000 kg/m³ with E near 20 GPa along the grain.
const E_GPA = 20
const BLANK = { lengthMm: 420, widthMm: 58, thicknessMm: 24, massG: 584.64 }
const RHO = (BLANK.massG / 1000) / (0.42 * 0.058 * 0.024)
// source: f₁ = (4.7300² / 2π L²) √(E t² / 12 ρ), uniform free–free bar (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1)
const F1 = (4.7300 ** 2 / (2 * Math.PI * 0.42 ** 2)) * Math.sqrt((E_GPA * 1e9 * 0.024 ** 2) / (12 * RHO))
const DECAY_DB_PER_S = 35

/** The blank's strike: one decaying sinusoid at F1, 2 s at 48 kHz. */
const WAV = encodeWav(synthStrike([{ frequencyHz: F1, amplitudeDb: -8, decayDbPerS: DECAY_DB_PER_S }], { sampleRate: 48000, durationS: 2, onsetS: 0.05, noiseDb: -80, seed: 3 }), 48000)

let benchmaker = ''
let office = ''
beforeAll(async () => {
  ({ benchmaker, office } = await benchMembers('Blank strike workshop'))
})

function gradeStrike(fields: Record<string, string | number>, bytes: Uint8Array = WAV, token = benchmaker, name = 'blank.wav') {
  const form = new FormData()
  form.set('file', new Blob([bytes], { type: name.endsWith('.wav') ? 'audio/wav' : 'text/plain' }), name)
  for (const [k, v] of Object.entries(fields)) form.set(k, String(v))
  return api('/api/blanks/grade', { method: 'POST', token, body: form })
}

describe('POST /api/blanks/grade with a recording of the strike', () => {
  it('measures the first mode and its decay and gets E back within 0.5 %, graded against the species', async () => {
    const reply = await gradeStrike({ ...BLANK, species: 'rosewood' })
    expect(reply.status).toBe(200)
    const body = reply.body
    // source: the acceptance bound, 0.5 %
    expect(Math.abs(body.youngsModulusGPa / E_GPA - 1)).toBeLessThan(0.005)
    expect(body.densityKgM3).toBeCloseTo(RHO, 6)
    expect(Math.abs(body.f1Hz / F1 - 1)).toBeLessThan(0.001)
    // source: η = D / (27.29 f) (Cremer & Heckl, Structure-Borne Sound); the engine's decay fit within 5 %
    expect(Math.abs(body.lossFactor / (DECAY_DB_PER_S / (27.29 * F1)) - 1)).toBeLessThan(0.05)
    // E/ρ = 20 GPa per g/cm³: usable but below rosewood's select limit (thresholds in shared/barModel/blankThresholds.ts)
    expect(body.specificModulus).toBeCloseTo(20, 1)
    expect(body.grade).toMatchObject({ species: 'rosewood', rank: 'usable' })
    expect(body.grade.reasons[0]).toMatch(/^E\/ρ of 20\.0 is below the select limit/)
  })

  it('refuses bad figures before any work (400), what is not a recording (415) and a role that may not strike (403)', async () => {
    const missing = await gradeStrike({ lengthMm: 420, widthMm: 58, thicknessMm: 24 })
    expect(missing.status).toBe(400)
    expect(missing.body.message).toMatch(/mass/i)
    const words = await gradeStrike({ ...BLANK, lengthMm: 'long' })
    expect(words.status).toBe(400)
    expect(words.body.message).toMatch(/length must be a number/)
    const species = await gradeStrike({ ...BLANK, species: 'cheese' })
    expect(species.status).toBe(400)
    expect(species.body.message).toMatch(/material is one of/)
    const text = await gradeStrike(BLANK, new TextEncoder().encode('not a recording'), benchmaker, 'notes.txt')
    expect(text.status).toBe(415)
    expect(text.body.message).toMatch(/\.$/)
    expect((await gradeStrike(BLANK, WAV, office)).status).toBe(403)
    const noFile = new FormData()
    noFile.set('lengthMm', '420')
    expect((await api('/api/blanks/grade', { method: 'POST', token: benchmaker, body: noFile })).status).toBe(400)
  })

  it('says so in a sentence when the recording holds no ringing mode', async () => {
    const silence = encodeWav(new Float64Array(48000), 48000)
    const reply = await gradeStrike(BLANK, silence)
    expect([422, 400]).toContain(reply.status)
    expect(reply.body.message).toMatch(/\.$/)
  })
})
