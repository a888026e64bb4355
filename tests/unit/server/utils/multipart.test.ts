import { describe, expect, it } from 'vitest'
import { readUpload } from '../../../../server/utils/multipart'
import { requestEvent } from '../../../support/h3Event'

const boundary = '----tonewright-7d93b1'

/** A multipart/form-data body as RFC 7578 lays it out: CRLF, "--boundary" before each part and "--boundary--" at the end. */
function form(parts: { name: string, filename?: string, type?: string, data: string | Uint8Array }[]): Uint8Array[] {
  const out: Uint8Array[] = []
  const text = (s: string) => out.push(new TextEncoder().encode(s))
  for (const part of parts) {
    text(`--${boundary}\r\nContent-Disposition: form-data; name="${part.name}"${part.filename === undefined ? '' : `; filename="${part.filename}"`}\r\n`)
    if (part.type) text(`Content-Type: ${part.type}\r\n`)
    text('\r\n')
    if (typeof part.data === 'string') text(part.data)
    else out.push(part.data)
    text('\r\n')
  }
  text(`--${boundary}--\r\n`)
  return out
}

const upload = (chunks: Uint8Array[], contentType = `multipart/form-data; boundary=${boundary}`) =>
  readUpload(requestEvent('POST', '/api/analyze', { 'content-type': contentType, 'content-length': String(chunks.reduce((n, c) => n + c.length, 0)) }, chunks))

describe('readUpload', () => {
  it('returns the file\'s bytes as sent and the plain fields', async () => {
    const bytes = Uint8Array.from([0x52, 0x49, 0x46, 0x46, 0x0d, 0x0a, 0x2d, 0x2d, 0x00, 0xff])
    const { file, fields } = await upload(form([
      { name: 'note', data: 'C5' },
      { name: 'file', filename: 'strike.wav', type: 'audio/wav', data: bytes },
      { name: 'target-hz', data: '523.25' },
    ]))
    expect([...file.bytes]).toEqual([...bytes])
    expect(file).toMatchObject({ filename: 'strike.wav', type: 'audio/wav' })
    expect(fields).toEqual({ 'note': 'C5', 'target-hz': '523.25' })
  })

  it('refuses what is not a multipart form with a file, with the right status and a plain sentence', async () => {
    await expect(upload(form([{ name: 'file', filename: 'a.wav', data: 'x' }]), 'audio/wav')).rejects.toMatchObject({ statusCode: 415 })
    await expect(upload(form([{ name: 'file', filename: 'a.wav', data: 'x' }]), 'multipart/form-data')).rejects.toMatchObject({ statusCode: 400 })
    await expect(upload(form([{ name: 'note', data: 'C5' }]))).rejects.toMatchObject({ statusCode: 400, message: 'Choose a recording to upload (the form has no "file").' })
  })
})
