import { describe, expect, it } from 'vitest'
import { encodeWav } from '../../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'
import { api, newWorkshop } from '../../support/http'

function form(bytes: Uint8Array, fields: Record<string, string> = {}, name = 'strike.wav') {
  const f = new FormData()
  f.set('file', new Blob([bytes], { type: 'application/octet-stream' }), name)
  for (const [k, v] of Object.entries(fields)) f.set(k, v)
  return f
}

// source: ISO 16:1975 — with A4 = 440 Hz, C4 = 261.626 Hz. The strike is synthesised
// at C4 + 2 cents with a double-octave partial at exactly 4 × the target.
const c4 = 440 * 2 ** (-9 / 12)
const wav = encodeWav(synthStrike([
  { frequencyHz: c4 * 2 ** (2 / 1200), amplitudeDb: -6, decayDbPerS: 20 },
  { frequencyHz: c4 * 4, amplitudeDb: -14, decayDbPerS: 35 },
], { sampleRate: 48000, durationS: 2, onsetS: 0.05, noiseDb: -80, seed: 3 }), 48000)

describe('POST /api/analyze', () => {
  it('needs a signed-in user', async () => {
    expect((await api('/api/analyze', { method: 'POST', body: form(wav) })).status).toBe(401)
  })

  it('answers the engine\'s JSON, with the CLI\'s option names as form fields', async () => {
    const { token } = await newWorkshop()
    const reply = await api('/api/analyze', { method: 'POST', token, body: form(wav, { 'note': 'C4', 'ratios': '1,4', 'tolerances': '3,5', 'reference-hz': '440' }) })
    expect(reply.status).toBe(200)
    expect(reply.body.engineVersion).toBe('2.0.0')
    expect(reply.body.sampleRate).toBe(48000)
    expect(reply.body.target.fundamentalHz).toBeCloseTo(261.626, 3)
    expect(reply.body.matches[0].cents).toBeCloseTo(2, 1)
    expect(reply.body.matches[1].cents).toBeCloseTo(0, 1)
    expect(reply.body.verdict).toBe('within')
    expect(reply.body.parameters.window).toBe('blackman-harris')
  })

  it('answers 415 for a file that is not audio, with a plain sentence', async () => {
    const { token } = await newWorkshop()
    const reply = await api('/api/analyze', { method: 'POST', token, body: form(new TextEncoder().encode('hello, not a sound'), {}, 'a.txt') })
    expect(reply.status).toBe(415)
    expect(reply.body.message).toMatch(/^[A-Z].*\.$/)
    expect(reply.body.stack).toBeUndefined()
  })

  it('answers 422 for digital silence and 400 for a bad option', async () => {
    const { token } = await newWorkshop()
    const silence = await api('/api/analyze', { method: 'POST', token, body: form(encodeWav(new Float64Array(48000), 48000)) })
    expect(silence.status).toBe(422)
    const bad = await api('/api/analyze', { method: 'POST', token, body: form(wav, { note: 'H9' }) })
    expect(bad.status).toBe(400)
  })

  it('answers 413 for an upload over 50 MB without reading it all', async () => {
    const { token } = await newWorkshop()
    const reply = await api('/api/analyze', { method: 'POST', token, body: form(new Uint8Array(52 * 1024 * 1024)) })
    expect(reply.status).toBe(413)
    expect(reply.body.message).toMatch(/50 MB/)
  })

  it('answers 400 when the form has no file', async () => {
    const { token } = await newWorkshop()
    const f = new FormData()
    f.set('note', 'C4')
    const reply = await api('/api/analyze', { method: 'POST', token, body: f })
    expect(reply.status).toBe(400)
  })
})
