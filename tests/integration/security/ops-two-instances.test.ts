// Class: operations — two app instances (the same build, two ports) on one PostgreSQL
// database and one S3 bucket behave as one service: audio, sessions, sign-in limits,
// the mail outbox and approval races are shared through the database and the bucket,
// never kept in one process.
import { createHash } from 'node:crypto'
import postgres from 'postgres'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { s3Storage } from '../../../server/utils/storage-s3'
import { approveAll, approvedSet } from '../support/certified-set'
import { api, memberWithRole, newWorkshop, useServer } from '../support/http'
import { mailTo, until, waitForMailTo } from '../support/mail'
import { createSet, postStrike, strikeWav } from '../support/records'
import { freshBucket, s3Env } from '../support/s3'
import { startServer, type ExtraServer } from '../support/server'

const PAIR_DATABASE_URL = process.env.TW_PAIR_DATABASE_URL
let a: ExtraServer
let b: ExtraServer
let bucket: Awaited<ReturnType<typeof freshBucket>>

beforeAll(async () => {
  if (!PAIR_DATABASE_URL) throw new Error('TW_PAIR_DATABASE_URL is not set: run this through scripts/test.sh (npm test).')
  bucket = await freshBucket('pair')
  // Only these two servers work on this database: the main test server's job workers never see it.
  const env = { NUXT_DATABASE_URL: PAIR_DATABASE_URL, ...s3Env(bucket), NUXT_ANALYSIS_THREADS: '1' }
  ;[a, b] = await Promise.all([
    startServer(env, Number(process.env.TONEWRIGHT_TEST_PAIR_PORT) || undefined),
    startServer(env),
  ])
  useServer(a.baseUrl)
})

let sql: ReturnType<typeof postgres> | undefined
/** Direct SQL on the pair's database (to read the outbox). */
const pairSql = () => (sql ??= postgres(PAIR_DATABASE_URL!, { max: 1, onnotice: () => {} }))

afterAll(async () => {
  await Promise.all([a?.stop(), b?.stop(), sql?.end()])
})

const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex')

async function download(baseUrl: string, path: string, token: string, headers: Record<string, string> = {}) {
  const response = await fetch(`${baseUrl}${path}`, { headers: { authorization: `Bearer ${token}`, ...headers } })
  return { status: response.status, headers: response.headers, bytes: new Uint8Array(await response.arrayBuffer()) }
}

describe('two app instances, one database, one bucket', () => {
  it('both are ready: PostgreSQL and the bucket answer', async () => {
    for (const server of [a, b]) {
      const ready = await api('/api/ready', { baseUrl: server.baseUrl })
      expect(ready.status).toBe(200)
      expect(ready.body).toEqual({ ready: true, db: true, storage: true })
    }
  })

  it('a session made on one works on the other, and ending it on one ends it on both', async () => {
    const owner = await newWorkshop('Pair sessions')
    const onB = await api('/api/auth/session', { token: owner.token, baseUrl: b.baseUrl })
    expect(onB.status).toBe(200)
    expect(onB.body.id).toBe(owner.userId)
    expect((await api('/api/auth/logout', { method: 'POST', token: owner.token, baseUrl: b.baseUrl })).status).toBeLessThan(300)
    expect((await api('/api/auth/session', { token: owner.token })).status).toBe(401)
  })

  it('a strike recorded through one is played back through the other, whole and by range', async () => {
    const owner = await newWorkshop('Pair audio')
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const wav = strikeWav(set.pieces[0].targetHz, [1, 4], [0, 0])
    const strike = await postStrike(owner.token, set.pieces[0].id, wav, { temperatureC: '21' })
    expect(strike.status).toBe(201)
    const id = strike.body.id ?? strike.body.strike?.id
    const whole = await download(b.baseUrl, `/api/strikes/${id}/audio`, owner.token)
    expect(whole.status).toBe(200)
    expect(whole.headers.get('accept-ranges')).toBe('bytes')
    expect(sha(whole.bytes)).toBe(sha(wav))
    // source: RFC 9110 §14.4 (Content-Range: bytes first-last/complete-length) and §15.3.7 (206)
    const part = await download(b.baseUrl, `/api/strikes/${id}/audio?inline=1`, owner.token, { range: 'bytes=1000-4999' })
    expect(part.status).toBe(206)
    expect(part.headers.get('content-range')).toBe(`bytes 1000-4999/${wav.byteLength}`)
    expect(part.headers.get('content-type')).toBe('audio/wav')
    expect(sha(part.bytes)).toBe(sha(wav.subarray(1000, 5000)))
    // The object is in the bucket under the workshop's folder, not in either process.
    const stored = await s3Storage(bucket).list(`workshops/${owner.workshopId}/`)
    expect(stored.map(o => o.key)).toEqual([`workshops/${owner.workshopId}/strikes/${set.pieces[0].id}/${id}.wav`])
  })

  it('sign-in limits are shared: 8 wrong passwords across both, then 429 on either', async () => {
    const owner = await newWorkshop('Pair limits')
    const statuses: number[] = []
    for (let i = 0; i < 10; i++) {
      const reply = await api('/api/auth/login', { method: 'POST', body: { email: owner.email, password: `wrong-${i}` }, baseUrl: i % 2 ? b.baseUrl : a.baseUrl })
      statuses.push(reply.status)
    }
    // source: DEVELOPERS.md, sign-in limits (8 failures per e-mail in 15 minutes)
    expect(statuses).toEqual([401, 401, 401, 401, 401, 401, 401, 401, 429, 429])
    expect((await api('/api/auth/login', { method: 'POST', body: { email: owner.email, password: owner.password }, baseUrl: b.baseUrl })).status).toBe(429)
  })

  it('an approval race across the two gives one 200 and one 409', async () => {
    const owner = await newWorkshop('Pair race')
    const supervisor = await memberWithRole(owner.token, 'supervisor')
    const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
    const piece = set.pieces[0]
    const strike = await postStrike(owner.token, piece.id, strikeWav(piece.targetHz, [1, 4], [0, 0]), { temperatureC: '21' })
    expect(strike.status).toBe(201)
    const { stage } = (await api(`/api/pieces/${piece.id}`, { token: owner.token })).body as { stage: string }
    for (const to of stage === 'tuning' ? ['review'] : ['tuning', 'review']) {
      expect((await api(`/api/pieces/${piece.id}/stage`, { method: 'POST', token: owner.token, body: { to } })).status).toBe(200)
    }
    const strikeId = strike.body.id ?? strike.body.strike?.id
    const replies = await Promise.all([a, b].map(server => api(`/api/pieces/${piece.id}/approve`, { method: 'POST', token: supervisor.token, body: { strikeId }, baseUrl: server.baseUrl })))
    expect(replies.map(r => r.status).sort()).toEqual([200, 409])
    expect(JSON.stringify(replies.find(r => r.status === 409)!.body)).not.toMatch(/stack|at \//)
    expect((await api(`/api/pieces/${piece.id}`, { token: owner.token, baseUrl: b.baseUrl })).body.stage).toBe('approved')
  })

  it('a certificate signed on one is mailed exactly once with both mail workers running, its PDF from the bucket', async () => {
    const ctx = await approvedSet({ from: 'C5', to: 'E5' })
    await approveAll(ctx, { databaseUrl: PAIR_DATABASE_URL })
    const signed = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token, baseUrl: b.baseUrl })
    expect(signed.status).toBe(201)
    const pdf = await until('the certificate PDF', async () => {
      const got = await download(a.baseUrl, `/api/certificates/${signed.body.id}/pdf`, ctx.office.token)
      return got.status === 200 ? got.bytes : null
    }, 60_000, 300)
    const queued = await api(`/api/certificates/${signed.body.id}/send`, { method: 'POST', token: ctx.office.token, body: {}, baseUrl: a.baseUrl })
    expect(queued.status).toBe(202)
    const message = await waitForMailTo(ctx.buyerEmail, 60_000)
    expect(message.attachments).toHaveLength(1)
    // Both workers poll the same outbox; give the slower one time to send a second copy if it could.
    const rows = await until('the outbox row marked sent', async () => {
      const found = await pairSql()`select status, attempts from mail_messages where "to" = ${ctx.buyerEmail}`
      return found.length === 1 && found[0]!.status === 'sent' ? found : null
    }, 20_000)
    expect(rows[0]!.attempts).toBe(1)
    await new Promise(resolve => setTimeout(resolve, 5000))
    expect(await mailTo(ctx.buyerEmail)).toHaveLength(1)
    expect((await s3Storage(bucket).list(`workshops/${ctx.owner.workshopId}/`)).some(o => o.key.endsWith('.pdf'))).toBe(true)
    expect(pdf.subarray(0, 5)).toEqual(new TextEncoder().encode('%PDF-'))
  })
})
