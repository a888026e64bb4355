// Class guarded here: playback by byte range (HTTP Range) on the strike audio route:
// exact bytes with 206, every range that cannot be served 416 with a sentence (never
// 500), and the route's usual 401/403/404 whatever the Range header says.
import { createHash } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { api, BASE_URL, memberOnTemporaryPassword, newWorkshop } from '../support/http'
import { createSet, postStrike, strikeWav } from '../support/records'

let owner: Awaited<ReturnType<typeof newWorkshop>>
let wav: Uint8Array
let id: string

beforeAll(async () => {
  owner = await newWorkshop('Range playback')
  const set = await createSet(owner.token, { fromNote: 'A4', toNote: 'A4' })
  wav = strikeWav(set.pieces[0].targetHz, [1, 4], [0, 0])
  const strike = await postStrike(owner.token, set.pieces[0].id, wav, { temperatureC: '21' })
  expect(strike.status).toBe(201)
  id = strike.body.id ?? strike.body.strike?.id
})

async function get(range: string | undefined, token = owner.token) {
  const headers: Record<string, string> = { authorization: `Bearer ${token}` }
  if (range !== undefined) headers.range = range
  const response = await fetch(`${BASE_URL}/api/strikes/${id}/audio?inline=1`, { headers })
  return { status: response.status, headers: response.headers, bytes: new Uint8Array(await response.arrayBuffer()) }
}
const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex')

describe('GET /api/strikes/:id/audio with Range', () => {
  // source: RFC 9110 §14.1.2 (range forms), §14.4 (Content-Range), §15.3.7 (206 Partial Content)
  it.each([
    ['bytes=0-0', 0, 0],
    ['bytes=44-1043', 44, 1043],
    ['bytes=-100', -100, -1],
    ['bytes=5000-', 5000, -1],
    ['bytes=10-99999999', 10, -1],
  ])('%s gives 206 with exactly those bytes', async (range, first, last) => {
    const start = first < 0 ? wav.byteLength + first : first
    const end = last < 0 ? wav.byteLength + last : last
    const got = await get(range)
    expect(got.status).toBe(206)
    expect(got.headers.get('content-range')).toBe(`bytes ${start}-${end}/${wav.byteLength}`)
    expect(got.headers.get('content-length')).toBe(String(end - start + 1))
    expect(got.headers.get('content-type')).toBe('audio/wav')
    expect(got.headers.get('x-content-type-options')).toBe('nosniff')
    expect(sha(got.bytes)).toBe(sha(wav.subarray(start, end + 1)))
  })

  it('without Range gives the whole recording, 200, and says ranges are accepted', async () => {
    const got = await get(undefined)
    expect(got.status).toBe(200)
    expect(got.headers.get('accept-ranges')).toBe('bytes')
    expect(sha(got.bytes)).toBe(sha(wav))
  })

  // source: RFC 9110 §15.5.17 (416 with Content-Range: bytes */complete-length)
  it.each([
    'bytes=abc', 'bytes=5-1', 'bytes=-', 'bytes=0-1,5-6', 'lines=0-5', 'bytes=99999999-', 'bytes=-0', '=', 'bytes=1e3-2e3',
    `bytes=${'9'.repeat(400)}-`, 'bytes=0x10-0x20',
  ])('%j is refused with 416 and a sentence, never 500', async (range) => {
    const response = await fetch(`${BASE_URL}/api/strikes/${id}/audio`, { headers: { authorization: `Bearer ${owner.token}`, range } })
    expect(response.status).toBe(416)
    expect(response.headers.get('content-range')).toBe(`bytes */${wav.byteLength}`)
    const body = await response.json()
    expect(body.message).toMatch(/range/i)
    expect(JSON.stringify(body)).not.toMatch(/\n\s+at |stack/)
  })

  it('another workshop gets 404, no session 401, a member on a temporary password 403, whatever the range', async () => {
    const stranger = await newWorkshop('Range stranger')
    expect((await get('bytes=0-10', stranger.token)).status).toBe(404)
    expect((await get('bytes=abc', stranger.token)).status).toBe(404)
    expect((await fetch(`${BASE_URL}/api/strikes/${id}/audio`, { headers: { range: 'bytes=0-10' } })).status).toBe(401)
    const temporary = await memberOnTemporaryPassword(owner.token, 'office')
    expect((await get('bytes=0-10', temporary.token)).status).toBe(403)
    expect((await api(`/api/strikes/not-a-uuid/audio`, { token: owner.token, headers: { range: 'bytes=0-1' } })).status).toBe(400)
  })
})
