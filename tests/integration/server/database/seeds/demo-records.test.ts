import postgres from 'postgres'
import { afterAll, describe, expect, it } from 'vitest'
import { DEMO_INPUTS } from '../../../../../server/database/seeds/demo-calibrations'
import { DEMO_CERTIFIED_SET } from '../../../../../server/database/seeds/demo-certified'
import { api, signIn } from '../../../support/http'

const DEMO_PASSWORD = 'tonewright-demo'
const sql = postgres(process.env.NUXT_DATABASE_URL!, { max: 1, onnotice: () => {} })
afterAll(() => sql.end())

interface Listed { id: string, setId: string, code: string, number: string, status: string, setSerial: string, pdfStatus: string, mails: { status: string, to: string }[] }

async function demoCertificate(token: string) {
  const list = await api<Listed[]>('/api/certificates', { token })
  expect(list.status).toBe(200)
  const cert = list.body.find(c => c.setSerial === DEMO_CERTIFIED_SET.serial)
  expect(cert, 'the seeded certified set has a certificate').toBeDefined()
  return cert!
}

describe('the demo workshop as seeded', () => {
  it('has a certified set whose signed certificate verifies publicly', async () => {
    const office = await signIn('office@tonewright.test', DEMO_PASSWORD)
    const cert = await demoCertificate(office)
    expect(cert.status).toBe('valid')
    const set = await api(`/api/sets/${cert.setId}`, { token: office })
    expect(set.body.pieces.length).toBeGreaterThan(0)
    expect(set.body.pieces.every((p: { stage: string }) => p.stage === 'certified')).toBe(true)
    // The public check recomputes the SHA-256 of the frozen content; no sign-in needed.
    const verified = await api(`/api/verify/${cert.code}`)
    expect(verified.status).toBe(200)
    expect(verified.body).toMatchObject({ status: 'valid', number: cert.number, hashMatches: true, buyerOrganisation: DEMO_CERTIFIED_SET.buyer.organisation })
    expect(verified.body.pieces.map((p: { note: string }) => p.note)).toEqual(set.body.pieces.map((p: { note: string }) => p.note))
    expect(verified.body.pieces.every((p: { verdict: string }) => p.verdict === 'within')).toBe(true)
  })

  it('e-mails that certificate to the buyer through the outbox, and the mail goes out once its PDF is stored', async () => {
    const owner = await signIn('owner@tonewright.test', DEMO_PASSWORD)
    let cert = await demoCertificate(owner)
    expect(cert.mails.map(m => m.to)).toEqual([DEMO_CERTIFIED_SET.buyer.email])
    // The PDF job renders it after start and the mail worker sends it then; both run in the test server.
    const until = Date.now() + 60_000
    while (Date.now() < until && (cert.pdfStatus !== 'ready' || cert.mails[0]?.status !== 'sent')) {
      await new Promise(r => setTimeout(r, 1000))
      cert = await demoCertificate(owner)
    }
    expect(cert.pdfStatus).toBe('ready')
    expect(cert.mails[0]?.status).toBe('sent')
  })

  it('has two inputs with calibrations over past months, one expired, and strikes recorded under the bench input\'s', async () => {
    const bench = await signIn('bench@tonewright.test', DEMO_PASSWORD)
    const list = await api('/api/calibrations', { token: bench })
    expect(list.status).toBe(200)
    const byName = Object.fromEntries(list.body.devices.map((d: { device: string }) => [d.device, d]))
    const desk = byName[DEMO_INPUTS.bench]
    const field = byName[DEMO_INPUTS.field]
    expect(desk.history).toHaveLength(4)
    expect(field.history).toHaveLength(3)
    expect(desk.current.expired).toBe(false)
    expect(field.current.expired).toBe(true)
    // The seed's tones were made at +42.2 … +41.3 ppm; each reading within 3u of what was made (JCGM 100:2008 §6.2, k = 3).
    expect(desk.history.map((c: { offsetPpm: number }) => Math.round(c.offsetPpm * 10) / 10)).toEqual([41.3, 41.6, 41.9, 42.2])
    const office = await signIn('office@tonewright.test', DEMO_PASSWORD)
    const cert = await demoCertificate(office)
    const set = await api(`/api/sets/${cert.setId}`, { token: office })
    const pieceIds = set.body.pieces.map((p: { id: string }) => p.id)
    const used = await sql`select distinct calibration_id from strikes where piece_id in ${sql(pieceIds)}`
    expect(used.map(r => r.calibration_id)).toEqual([desk.current.id])
  })
})
