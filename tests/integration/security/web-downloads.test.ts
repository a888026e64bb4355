import { readFile } from 'node:fs/promises'
import { describe, expect, it } from 'vitest'
import { api, BASE_URL, memberWithRole, newWorkshop } from '../support/http'
import { approveAll, approvedSet } from '../support/certified-set'
import { createSet, postStrike, strikeWav } from '../support/records'
import { until } from '../support/mail'

// Class guarded here: stored audio and certificates are served with a type the
// server chose from the bytes, never sniffed, downloaded unless played in place.

async function download(path: string, token: string) {
  const response = await fetch(`${BASE_URL}${path}`, { headers: { authorization: `Bearer ${token}` } })
  return { status: response.status, headers: response.headers, bytes: new Uint8Array(await response.arrayBuffer()) }
}

describe('downloads are typed by the server and never sniffed', () => {
  it('a WAV sent as text/html named .html comes back as audio/wav, as an attachment, nosniff', async () => {
    const owner = await newWorkshop('Audio types')
    const set = await createSet(owner.token)
    const piece = set.pieces[0]
    const wav = strikeWav(piece.targetHz, [1, 4], [0, 0])
    const form = new FormData()
    form.set('file', new Blob([wav], { type: 'text/html' }), 'page.html')
    form.set('temperatureC', '21')
    const strike = await api(`/api/pieces/${piece.id}/strikes`, { method: 'POST', token: owner.token, body: form })
    expect(strike.status).toBe(201)
    const id = strike.body.id ?? strike.body.strike?.id
    const got = await download(`/api/strikes/${id}/audio`, owner.token)
    expect(got.status).toBe(200)
    // source: RFC 2361 / IANA media types (audio/wav)
    expect(got.headers.get('content-type')).toBe('audio/wav')
    expect(got.headers.get('x-content-type-options')).toBe('nosniff')
    expect(got.headers.get('content-disposition')).toBe(`attachment; filename="${id}.wav"`)
    expect(got.headers.get('content-security-policy')).toContain('sandbox')
    expect(got.bytes.byteLength).toBe(wav.byteLength)
    const inline = await download(`/api/strikes/${id}/audio?inline=1`, owner.token)
    expect(inline.headers.get('content-type')).toBe('audio/wav')
    expect(inline.headers.get('content-disposition')).toBe(`inline; filename="${id}.wav"`)
    expect((await download(`/api/strikes/${id}/audio?inline=yes`, owner.token)).status).toBe(400)
  })

  // Each container keeps its own type and extension whatever the uploader said, and comes back byte for byte.
  // source: RFC 9639 (FLAC), media type audio/flac; audio/aiff as browsers send it for .aif (common practice).
  const CONTAINERS: [string, string, string, string, string][] = [
    ['a FLAC named .svg', 'strike-48k.flac', 'x.svg', 'audio/flac', 'flac'],
    ['an AIFF from a recorder', 'strike-48k-16bit.aiff', 'C4 take 2.aif', 'audio/aiff', 'aiff'],
  ]
  for (const [name, fixture, uploadName, mediaType, extension] of CONTAINERS) {
    it(`${name} is stored and served as ${mediaType}`, async () => {
      const owner = await newWorkshop(`Audio ${extension}`)
      const set = await createSet(owner.token)
      const bytes = await readFile(`tests/fixtures/audio/${fixture}`)
      const strike = await postStrike(owner.token, set.pieces[1].id, bytes, { temperatureC: '21' }, uploadName)
      expect(strike.status).toBe(201)
      const id = strike.body.id ?? strike.body.strike?.id
      const got = await download(`/api/strikes/${id}/audio`, owner.token)
      expect(got.headers.get('content-type')).toBe(mediaType)
      expect(got.headers.get('content-disposition')).toBe(`attachment; filename="${id}.${extension}"`)
      expect(Buffer.from(got.bytes).equals(bytes)).toBe(true)
    })
  }

  it('another workshop\'s recording is 404, without a session 401', async () => {
    const owner = await newWorkshop('Audio owner')
    const stranger = await newWorkshop('Audio stranger')
    const set = await createSet(owner.token)
    const strike = await postStrike(owner.token, set.pieces[0].id, strikeWav(set.pieces[0].targetHz, [1, 4], [0, 0]), { temperatureC: '21' })
    const id = strike.body.id ?? strike.body.strike?.id
    expect((await download(`/api/strikes/${id}/audio`, stranger.token)).status).toBe(404)
    expect((await fetch(`${BASE_URL}/api/strikes/${id}/audio`)).status).toBe(401)
    const office = await memberWithRole(owner.token, 'office')
    expect((await download(`/api/strikes/${id}/audio`, office.token)).status).toBe(200)
  })

  it('a certificate PDF is application/pdf and nosniff', async () => {
    const ctx = await approvedSet({ from: 'C5', to: 'E5' })
    await approveAll(ctx)
    const cert = await api(`/api/sets/${ctx.set.id}/certificates`, { method: 'POST', token: ctx.supervisor.token })
    expect(cert.status).toBe(201)
    // The PDF may be rendered by a job after signing: wait until it is there.
    const pdf = await until('the certificate PDF', async () => {
      const got = await download(`/api/certificates/${cert.body.id}/pdf`, ctx.office.token)
      return got.status === 200 ? got : null
    })
    expect(pdf.headers.get('content-type')).toBe('application/pdf')
    expect(pdf.headers.get('x-content-type-options')).toBe('nosniff')
    expect(Buffer.from(pdf.bytes.subarray(0, 5)).toString('latin1')).toBe('%PDF-')
    const stranger = await newWorkshop('PDF stranger')
    expect((await download(`/api/certificates/${cert.body.id}/pdf`, stranger.token)).status).toBe(404)
  })
})
