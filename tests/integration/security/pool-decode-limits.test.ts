import { beforeAll, describe, expect, it } from 'vitest'
import { encodeWav } from '../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../shared/synthesis/synthStrike'
import { flacBomb, opusBomb } from '../../support/audioBombs'
import { api, newWorkshop } from '../support/http'

function form(bytes: Uint8Array, name: string) {
  const body = new FormData()
  body.set('file', new Blob([bytes], { type: 'application/octet-stream' }), name)
  body.set('target-hz', '440')
  return body
}

describe('class: compressed audio cannot expand past the limits (decode bombs)', () => {
  let token: string
  beforeAll(async () => {
    token = (await newWorkshop('Bomb workshop')).token
  })

  it.each([
    ['a 81-byte FLAC whose STREAMINFO declares two hours', () => flacBomb({ declaredFrames: 48000 * 7200, blocks: 3 }), 'bomb.flac', /says it lasts 7200\.0 s/],
    ['an Ogg Opus whose last granule declares two hours', () => opusBomb({ declaredFrames: 48000 * 7200, pages: 2 }), 'bomb.opus', /says it lasts 7200\.0 s/],
    ['a 14 kB FLAC that states no length and expands to 23 minutes', () => flacBomb({ declaredFrames: 0, blocks: 1000 }), 'quiet.flac', /more than 60 s/],
  ])('%s answers 422 with a plain sentence, in well under a second', async (_, make, name, sentence) => {
    const started = performance.now()
    const reply = await api('/api/analyze', { method: 'POST', token, body: form(make(), name) })
    const elapsedMs = performance.now() - started
    expect(reply.status).toBe(422)
    expect(reply.body.message).toMatch(sentence)
    expect(reply.body.message).toMatch(/record a single strike of at most 60 seconds\.$/)
    // Generous bound (the issue: "well under a second"); figures in scripts/bench-health-during-analysis.ts.
    expect(elapsedMs).toBeLessThan(5000)
  })

  it('the server still measures a real strike after the bombs', async () => {
    const wav = encodeWav(synthStrike([{ frequencyHz: 440, amplitudeDb: -10, decayDbPerS: 10 }], { sampleRate: 48000, durationS: 1, onsetS: 0.05, noiseDb: -75, seed: 2 }), 48000)
    const reply = await api('/api/analyze', { method: 'POST', token, body: form(wav, 'ok.wav') })
    expect(reply.status).toBe(200)
    expect(reply.body.fundamentalHz).toBeCloseTo(440, 1)
  })
})

describe('class: a WAV whose header declares more audio than the file holds is never measured silently', () => {
  it('measures the 0.5 s present of a WAV that declares 10 s and warns that it is truncated', async () => {
    const { token } = await newWorkshop('Truncated WAV workshop')
    const whole = encodeWav(synthStrike([{ frequencyHz: 440, amplitudeDb: -10, decayDbPerS: 10 }], { sampleRate: 48000, durationS: 10, onsetS: 0.05, noiseDb: -75, seed: 4 }), 48000)
    const cut = whole.slice(0, 44 + 48000 * 2 / 2)
    const reply = await api('/api/analyze', { method: 'POST', token, body: form(cut, 'cut.wav') })
    expect(reply.status).toBe(200)
    expect(reply.body.warnings[0]).toMatch(/^truncated WAV file: the header declares 10\.00 s of audio but the file holds 0\.50 s/)
    expect(reply.body.fundamentalHz).toBeCloseTo(440, 0)
  })
})
