import postgres from 'postgres'
import { afterAll, describe, expect, it } from 'vitest'
import { encodeWav } from '../../../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../../../shared/synthesis/synthStrike'
import { benchMembers } from '../../../support/bench-members'
import { api } from '../../../support/http'

const sql = postgres(process.env.NUXT_DATABASE_URL!, { max: 1, onnotice: () => {} })
afterAll(() => sql.end())

function form(bytes: Uint8Array | null, fields: Record<string, string>) {
  const f = new FormData()
  if (bytes) f.set('file', new Blob([bytes], { type: 'audio/wav' }), 'reference.wav')
  for (const [k, v] of Object.entries(fields)) f.set(k, v)
  return f
}

// The check of issue 15: a 1000 Hz reference on an input that reads 300 ppm high, SNR ≈ 31 dB (−6 dBFS peak tone, −40 dBFS noise).
const tone = encodeWav(synthStrike([{ frequencyHz: 1000 * (1 + 300e-6), amplitudeDb: -6, decayDbPerS: 0 }], { sampleRate: 48000, durationS: 6, noiseDb: -40, seed: 9 }), 48000)
const fields = { referenceHz: '1000', device: 'Bench interface, input 1', referenceUncertaintyPpm: '0.5', reference: 'Signal generator on the workshop clock' }

async function rowsOf(workshopToken: string) {
  const session = await api('/api/auth/session', { token: workshopToken })
  return sql`select device, offset_ppm, uncertainty_ppm, reference_uncertainty_ppm, reference_description from calibrations c join memberships m on m.workshop_id = c.workshop_id where m.user_id = ${session.body.id}`
}

describe('POST /api/calibrations', () => {
  it('needs a signed-in member who may record strikes', async () => {
    const { office } = await benchMembers('Calibration roles')
    expect((await api('/api/calibrations', { method: 'POST', body: form(tone, fields) })).status).toBe(401)
    const refused = await api('/api/calibrations', { method: 'POST', token: office, body: form(tone, fields) })
    expect(refused.status).toBe(403)
    expect(await rowsOf(office)).toHaveLength(0)
  })

  it('measures the tone and keeps the calibration for the workshop', async () => {
    const { benchmaker, owner } = await benchMembers('Calibration workshop')
    const reply = await api('/api/calibrations', { method: 'POST', token: benchmaker, body: form(tone, fields) })
    expect(reply.status).toBe(201)
    expect(Object.keys(reply.body).sort()).toEqual(['id', 'offsetPpm', 'uncertaintyPpm'])
    expect(Math.abs(reply.body.offsetPpm - 300)).toBeLessThan(2)
    expect(reply.body.uncertaintyPpm).toBeGreaterThanOrEqual(0.5)
    const rows = await rowsOf(owner)
    expect(rows).toHaveLength(1)
    expect(rows[0]!.device).toBe('Bench interface, input 1')
    expect(rows[0]!.offset_ppm).toBeCloseTo(reply.body.offsetPpm, 9)
    expect(rows[0]!.reference_description).toBe('Signal generator on the workshop clock')
  })

  it('refuses bad fields with a plain sentence before measuring, and stores nothing', async () => {
    const { benchmaker } = await benchMembers('Calibration fields')
    for (const bad of [
      { ...fields, referenceHz: 'a thousand' },
      { ...fields, referenceHz: '5' },
      { ...fields, device: '   ' },
      { ...fields, referenceUncertaintyPpm: '-1' },
      { ...fields, reference: 'x'.repeat(301) },
      { referenceHz: '1000' },
    ]) {
      const reply = await api('/api/calibrations', { method: 'POST', token: benchmaker, body: form(tone, bad) })
      expect(reply.status).toBe(400)
      expect(reply.body.message).toMatch(/^[a-zA-Z].*\.$/)
      expect(reply.body.stack).toBeUndefined()
    }
    expect((await api('/api/calibrations', { method: 'POST', token: benchmaker, body: form(null, fields) })).status).toBe(400)
    expect(await rowsOf(benchmaker)).toHaveLength(0)
  })

  it('refuses what is not a usable reference tone: not audio 415, no tone 422, oversized 413', async () => {
    const { benchmaker } = await benchMembers('Calibration hostile')
    const text = await api('/api/calibrations', { method: 'POST', token: benchmaker, body: form(new TextEncoder().encode('not a sound'), fields) })
    expect(text.status).toBe(415)
    const noise = encodeWav(synthStrike([], { sampleRate: 48000, durationS: 4, noiseDb: -20, seed: 2 }), 48000)
    const none = await api('/api/calibrations', { method: 'POST', token: benchmaker, body: form(noise, fields) })
    expect(none.status).toBe(422)
    expect(none.body.message).toMatch(/no steady tone/)
    const short = encodeWav(synthStrike([{ frequencyHz: 1000, amplitudeDb: -6, decayDbPerS: 0 }], { sampleRate: 48000, durationS: 1, seed: 2 }), 48000)
    expect((await api('/api/calibrations', { method: 'POST', token: benchmaker, body: form(short, fields) })).status).toBe(422)
    const huge = await api('/api/calibrations', { method: 'POST', token: benchmaker, body: form(new Uint8Array(52 * 1024 * 1024), fields) })
    expect(huge.status).toBe(413)
    expect(await rowsOf(benchmaker)).toHaveLength(0)
  })

  it('keeps every one of racing calibrations of the same device', async () => {
    const { benchmaker, owner } = await benchMembers('Calibration race')
    const replies = await Promise.all([0, 1, 2].map(() => api('/api/calibrations', { method: 'POST', token: benchmaker, body: form(tone, fields) })))
    expect(replies.map(r => r.status).every(s => s === 201 || s === 503)).toBe(true)
    const kept = replies.filter(r => r.status === 201)
    expect(new Set(kept.map(r => r.body.id)).size).toBe(kept.length)
    expect(await rowsOf(owner)).toHaveLength(kept.length)
  })
})
