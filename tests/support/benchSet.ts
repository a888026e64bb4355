import { randomUUID } from 'node:crypto'

interface Reply { status: number, body: any }

async function call(base: string, path: string, token: string | null, method = 'GET', body?: unknown): Promise<Reply> {
  const headers: Record<string, string> = { accept: 'application/json' }
  if (token) headers.authorization = `Bearer ${token}`
  if (body !== undefined) headers['content-type'] = 'application/json'
  const r = await fetch(`${base}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) })
  const text = await r.text()
  return { status: r.status, body: text ? JSON.parse(text) : null }
}

/**
 * A fresh marimba set C4…E4 (chromatic, A4 = 440 Hz, the triple 1 : 4 : 10 template) in the
 * demo workshop, entered by the demo office, for the Bench tests and benchmark.
 */
export async function createBenchSet(base: string, fromNote = 'C4', toNote = 'E4') {
  const login = await call(base, '/api/auth/login', null, 'POST', { email: 'office@tonewright.test', password: 'tonewright-demo' })
  if (login.status !== 200) throw new Error(`sign-in failed: ${login.status}`)
  const token = login.body.token as string
  const templates = await call(base, '/api/templates', token)
  const list = (Array.isArray(templates.body) ? templates.body : templates.body.items) as { id: string, name: string }[]
  const template = list.find(t => t.name.startsWith('Marimba bar, triple'))
  if (!template) throw new Error('The starter marimba template is missing.')
  const serial = `BT-${randomUUID().slice(0, 8)}`
  const created = await call(base, '/api/sets', token, 'POST', {
    name: `Bench test marimba ${serial}`, model: 'Practice marimba', serial,
    buyer: { name: 'Rowan Testbuyer', organisation: 'Example Test School', email: 'buyer@example.test' },
    referenceHz: 440, fromNote, toNote, chromatic: true, templateId: template.id,
  })
  if (created.status !== 201 && created.status !== 200) throw new Error(`set creation failed: ${created.status} ${JSON.stringify(created.body)}`)
  const set = await call(base, `/api/sets/${created.body.id}`, token)
  const pieces = set.body.pieces as { id: string, note: string, position: number }[]
  const benchLogin = await call(base, '/api/auth/login', null, 'POST', { email: 'bench@tonewright.test', password: 'tonewright-demo' })
  return { setId: created.body.id as string, serial, pieces, byNote: (note: string) => pieces.find(p => p.note === note)!, token, benchToken: benchLogin.body.token as string }
}

/** The piece as the API gives it (strikes newest first). */
export async function pieceOf(base: string, token: string, id: string) {
  return (await call(base, `/api/pieces/${id}`, token)).body as { strikeCount: number, strikes: { id: string, temperatureC: number | null, humidityPct: number | null }[], stage: string }
}
