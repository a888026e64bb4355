import { describe, expect, it } from 'vitest'
import { hasBody, readBodyLimited } from '../../../../server/utils/request-body'
import { requestEvent } from '../../../support/h3Event'

/** A POST whose body arrives in `chunks`, with these headers. */
const streaming = (headers: Record<string, string>, chunks: string[]) => requestEvent('POST', '/api/strikes', headers, chunks)

const TOO_LARGE = 'The recording is larger than 10 bytes.'

describe('hasBody', () => {
  it('sees a body by a positive Content-Length or chunked transfer coding', () => {
    // source: RFC 9112 §6.1–6.3, a message body is signalled by Transfer-Encoding or Content-Length
    expect(hasBody(requestEvent('POST', '/', { 'content-length': '12' }))).toBe(true)
    expect(hasBody(requestEvent('POST', '/', { 'transfer-encoding': 'gzip, chunked' }))).toBe(true)
    expect(hasBody(requestEvent('POST', '/', { 'content-length': '0' }))).toBe(false)
    expect(hasBody(requestEvent('POST', '/', {}))).toBe(false)
  })
})

describe('readBodyLimited', () => {
  it('returns the body that came, in one buffer, and the same promise when asked again', async () => {
    const event = streaming({ 'content-length': '9' }, ['strike', '123'])
    const body = await readBodyLimited(event, 10, TOO_LARGE)
    expect(body.toString()).toBe('strike123')
    expect(await readBodyLimited(event, 10, TOO_LARGE)).toBe(body)
  })

  it('refuses a declared length over the limit with 413 before reading', async () => {
    await expect(readBodyLimited(streaming({ 'content-length': '11' }, []), 10, TOO_LARGE)).rejects.toMatchObject({ statusCode: 413, message: TOO_LARGE })
  })

  it('refuses a chunked body the moment it passes the limit', async () => {
    const event = streaming({ 'transfer-encoding': 'chunked' }, ['123456', '789012'])
    await expect(readBodyLimited(event, 10, TOO_LARGE)).rejects.toMatchObject({ statusCode: 413 })
  })

  it('refuses a body longer than its Content-Length', async () => {
    await expect(readBodyLimited(streaming({ 'content-length': '4' }, ['12345']), 10, TOO_LARGE)).rejects.toThrow(/longer than its Content-Length/)
  })

  it('reads nothing without a body', async () => {
    expect((await readBodyLimited(requestEvent('POST', '/', {}), 10, TOO_LARGE)).length).toBe(0)
  })
})
