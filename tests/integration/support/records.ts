import { encodeWav } from '../../../shared/analysis/encodeWav'
import { synthStrike } from '../../../shared/synthesis/synthStrike'
import { api } from './http'

export async function templateId(token: string, name: string) {
  const reply = await api('/api/templates', { token })
  const t = reply.body.find((x: { name: string }) => x.name === name)
  if (!t) throw new Error(`no template ${name}`)
  return t.id as string
}

let serial = 0
export async function createSet(token: string, overrides: Record<string, unknown> = {}) {
  const body = {
    name: 'Test marimba', model: 'TM-1', serial: `T-${Date.now()}-${serial++}`,
    buyer: { name: 'A Buyer', organisation: 'A School', email: 'buyer@example.test' },
    referenceHz: 440, fromNote: 'C4', toNote: 'E4', chromatic: true,
    templateId: await templateId(token, 'Marimba bar, double (1 : 4)'),
    ...overrides,
  }
  const reply = await api('/api/sets', { method: 'POST', token, body })
  if (reply.status !== 201) throw new Error(`create set failed: ${reply.status} ${JSON.stringify(reply.body)}`)
  const set = await api(`/api/sets/${reply.body.id}`, { token })
  return set.body
}

/** A 1.5 s WAV of a bar at `targetHz` with partials at the given ratios, each detuned by `cents`. */
export function strikeWav(targetHz: number, ratios: number[], cents: number[], seed = 7) {
  const sampleRate = 48000
  const samples = synthStrike(
    ratios.map((r, i) => ({ frequencyHz: targetHz * r * 2 ** ((cents[i] ?? 0) / 1200), amplitudeDb: -10 - 6 * i, decayDbPerS: 12 + 6 * i })),
    { sampleRate, durationS: 1.5, onsetS: 0.05, noiseDb: -75, seed },
  )
  return encodeWav(samples, sampleRate)
}

export async function postStrike(token: string, pieceId: string, bytes: Uint8Array, fields: Record<string, string> = {}, filename = 'strike.wav') {
  const form = new FormData()
  form.set('file', new Blob([bytes], { type: 'audio/wav' }), filename)
  for (const [k, v] of Object.entries(fields)) form.set(k, v)
  return api(`/api/pieces/${pieceId}/strikes`, { method: 'POST', token, body: form })
}
