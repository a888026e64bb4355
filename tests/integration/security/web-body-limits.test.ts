import { describe, expect, it } from 'vitest'
import { api, newWorkshop } from '../support/http'
import { createSet, strikeWav } from '../support/records'
import { rawRequest, zeroChunks } from './support'

// Class guarded here: request bodies are limited while they are read (JSON 1 MB,
// 64 kB on public routes, uploads 50 MB), for chunked bodies too: 413 as soon as
// the limit passes; nothing more is kept, and a client that goes on sending is
// cut off after at most 64 MB more.
const MB = 1024 * 1024
// source: the contract (shared/analysis/limits.ts LIMITS.maxBytes = 50 MB)
const UPLOAD_LIMIT = 50 * MB

/** A multipart body around `fileBytes` zero bytes, as chunks; `length` is its total size. */
function multipart(fileBytes: number, boundary = 'twboundary') {
  const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="temperatureC"\r\n\r\n21\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.wav"\r\nContent-Type: audio/wav\r\n\r\n`)
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`)
  const size = 64 * 1024
  function* chunks() {
    yield head
    let left = fileBytes
    const zero = new Uint8Array(size)
    while (left > 0) {
      const n = Math.min(size, left)
      yield n === size ? zero : zero.subarray(0, n)
      left -= n
    }
    yield tail
  }
  return { chunks: chunks(), length: head.length + fileBytes + tail.length, type: `multipart/form-data; boundary=${boundary}` }
}

describe('request bodies are limited while they are read', () => {
  it('refuses a JSON body over 1 MB by its declared length, before reading it', async () => {
    const owner = await newWorkshop('Big JSON')
    const reply = await rawRequest('/api/lots', { headers: { 'authorization': `Bearer ${owner.token}`, 'content-type': 'application/json' }, chunks: zeroChunks(24), length: 24 * 64 * 1024 + 10 })
    expect(reply.status).toBe(413)
    expect(JSON.parse(reply.body).message).toMatch(/larger than 1 MB/)
  })

  it('refuses a chunked JSON body as soon as it passes 1 MB, keeps nothing more and cuts a client that goes on', async () => {
    const owner = await newWorkshop('Chunked JSON')
    // 200 MB on offer, without a length, and the client goes on sending after the answer.
    const reply = await rawRequest('/api/lots', { headers: { 'authorization': `Bearer ${owner.token}`, 'content-type': 'application/json' }, chunks: zeroChunks(16 * 200), keepSending: true })
    expect(reply.status, reply.body).toBe(413)
    expect(JSON.parse(reply.body).message).toMatch(/larger than 1 MB/)
    expect(reply.sentBytes).toBeLessThan(40 * MB)
    expect(reply.cut).toBe(true)
    // The server discards at most 64 MB after its answer, then cuts: far from the 200 MB on offer.
    expect(reply.totalSent).toBeLessThan(120 * MB)
    expect((await api('/api/health')).status).toBe(200)
  })

  it('allows public auth routes only 64 kB', async () => {
    const padding = 'x'.repeat(70 * 1024)
    const big = await api('/api/auth/login', { method: 'POST', body: { email: 'a@example.test', password: padding } })
    expect(big.status).toBe(413)
    expect(big.body.message).toMatch(/64 kB/)
    const chunked = await rawRequest('/api/auth/signup', { headers: { 'content-type': 'application/json' }, chunks: zeroChunks(8, 16 * 1024) })
    expect(chunked.status).toBe(413)
    const small = await api('/api/auth/login', { method: 'POST', body: { email: 'nobody@example.test', password: 'x'.repeat(60) } })
    expect(small.status).not.toBe(413)
    expect(small.status).toBeLessThan(500)
  })

  it('lets a signed-in JSON body of a few hundred kB through to its route', async () => {
    const owner = await newWorkshop('Mid JSON')
    const reply = await api('/api/lots', { method: 'POST', token: owner.token, body: { code: 'MID-1', material: 'Maple', notes: 'n'.repeat(300 * 1024) } })
    // Past the size guard: the route's own validation answers (notes are at most 2000 characters).
    expect(reply.status).toBe(400)
    expect(reply.body.message).toMatch(/Notes/)
  })

  it('refuses an upload whose declared length is over 50 MB at once', async () => {
    const owner = await newWorkshop('Big declared upload')
    const set = await createSet(owner.token)
    const form = multipart(UPLOAD_LIMIT + MB)
    const reply = await rawRequest(`/api/pieces/${set.pieces[0].id}/strikes`, { headers: { 'authorization': `Bearer ${owner.token}`, 'content-type': form.type }, chunks: form.chunks, length: form.length })
    expect(reply.status).toBe(413)
    expect(JSON.parse(reply.body).message).toMatch(/50 MB/)
    expect(reply.sentBytes).toBeLessThan(UPLOAD_LIMIT)
  })

  it('refuses a chunked 56 MB upload as soon as it passes the limit, keeps serving, and records nothing', async () => {
    const owner = await newWorkshop('Chunked upload')
    const set = await createSet(owner.token)
    const piece = set.pieces[0]
    const form = multipart(56 * MB)
    const reply = await rawRequest(`/api/pieces/${piece.id}/strikes`, { headers: { 'authorization': `Bearer ${owner.token}`, 'content-type': form.type }, chunks: form.chunks })
    expect(reply.status).toBe(413)
    expect(JSON.parse(reply.body).message).toMatch(/50 MB/)
    // Counted as it arrived: refused only once the limit had passed.
    expect(reply.sentBytes).toBeGreaterThan(UPLOAD_LIMIT)
    expect((await api('/api/health')).status).toBe(200)
    const after = await api(`/api/pieces/${piece.id}`, { token: owner.token })
    expect(after.body.strikes ?? []).toEqual([])
  })

  it('cuts off a chunked upload that goes on far past the limit', async () => {
    const owner = await newWorkshop('Endless upload')
    const set = await createSet(owner.token)
    const form = multipart(400 * MB)
    const reply = await rawRequest(`/api/pieces/${set.pieces[0].id}/strikes`, { headers: { 'authorization': `Bearer ${owner.token}`, 'content-type': form.type }, chunks: form.chunks, keepSending: true })
    expect(reply.status).toBe(413)
    expect(reply.cut).toBe(true)
    expect(reply.totalSent).toBeLessThan(UPLOAD_LIMIT + 100 * MB)
  })

  it('still records a strike sent chunked, under the limit', async () => {
    const owner = await newWorkshop('Chunked small upload')
    const set = await createSet(owner.token)
    const piece = set.pieces[0]
    const wav = strikeWav(piece.targetHz, [1, 4], [0, 0])
    const boundary = 'smallboundary'
    const chunks = [
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="temperatureC"\r\n\r\n20.5\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="strike.wav"\r\nContent-Type: audio/wav\r\n\r\n`),
      Buffer.from(wav.subarray(0, 1000)), Buffer.from(wav.subarray(1000)),
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]
    const reply = await rawRequest(`/api/pieces/${piece.id}/strikes`, { headers: { 'authorization': `Bearer ${owner.token}`, 'content-type': `multipart/form-data; boundary=${boundary}` }, chunks })
    expect(reply.status).toBe(201)
  })

  it('answers a damaged multipart body with 400, not 500', async () => {
    const owner = await newWorkshop('Damaged form')
    const set = await createSet(owner.token)
    const reply = await rawRequest(`/api/pieces/${set.pieces[0].id}/strikes`, {
      headers: { 'authorization': `Bearer ${owner.token}`, 'content-type': 'multipart/form-data; boundary=abc' },
      chunks: [Buffer.from('--abc\r\nContent-Disposition: form-data; name="file"; filename="x.wav"\r\n\r\nno closing boundary')],
    })
    expect(reply.status).toBe(400)
  })
})
