import { describe, expect, it } from 'vitest'
import { boundaryOf, parseMultipart } from '../../../../server/utils/multipart-parse'

/** A body encoded by the platform's own FormData serializer (WHATWG Fetch, as browsers send it). */
async function encode(form: FormData) {
  const response = new Response(form)
  const type = response.headers.get('content-type')!
  return { body: Buffer.from(await response.arrayBuffer()), boundary: boundaryOf(type)! }
}

describe('parseMultipart', () => {
  it('reads what the WHATWG FormData encoder writes: fields, a file with its name and type, bytes intact', async () => {
    const bytes = new Uint8Array(70_000).map((_, i) => (i * 31) % 256)
    // CR LF and dashes inside the file must not end it early.
    bytes.set([13, 10, 45, 45, 13, 10], 1000)
    const form = new FormData()
    form.set('temperatureC', '21.5')
    form.set('file', new Blob([bytes], { type: 'audio/wav' }), 'Glöckchen C6.wav')
    form.set('note', 'naïve "quoted" value')
    const { body, boundary } = await encode(form)
    const parts = parseMultipart(body, boundary)!
    expect(parts.map(p => p.name)).toEqual(['temperatureC', 'file', 'note'])
    expect(parts[0]!.data.toString()).toBe('21.5')
    expect(parts[1]!.filename).toBe('Glöckchen C6.wav')
    expect(parts[1]!.type).toBe('audio/wav')
    expect(Buffer.compare(parts[1]!.data, Buffer.from(bytes))).toBe(0)
    expect(parts[2]!.data.toString()).toBe('naïve "quoted" value')
  })

  it('gives views into the body, not copies', async () => {
    const form = new FormData()
    form.set('file', new Blob([new Uint8Array(4096).fill(7)]), 'a.bin')
    const { body, boundary } = await encode(form)
    const [part] = parseMultipart(body, boundary)!
    expect(part!.data.buffer).toBe(body.buffer)
  })

  it('reads an empty form and a preamble before the first boundary (RFC 2046 §5.1.1)', () => {
    expect(parseMultipart(Buffer.from('--b--\r\n'), 'b')).toEqual([])
    const parts = parseMultipart(Buffer.from('ignored preamble\r\n--b\r\nContent-Disposition: form-data; name=x\r\n\r\n1\r\n--b--'), 'b')!
    expect(parts.map(p => [p.name, p.data.toString()])).toEqual([['x', '1']])
  })

  it('refuses bodies that are cut short, have no boundary, lack a name or have too many parts', () => {
    expect(parseMultipart(Buffer.from('--b\r\nContent-Disposition: form-data; name="x"\r\n\r\nno end'), 'b')).toBeNull()
    expect(parseMultipart(Buffer.from('just text'), 'b')).toBeNull()
    expect(parseMultipart(Buffer.from('--b\r\nContent-Type: text/plain\r\n\r\n1\r\n--b--'), 'b')).toBeNull()
    expect(parseMultipart(Buffer.from(`--b\r\nContent-Disposition: form-data; name="h"\r\nX: ${'y'.repeat(9000)}\r\n\r\n1\r\n--b--`), 'b')).toBeNull()
    const many = `${Array.from({ length: 40 }, (_, i) => `--b\r\nContent-Disposition: form-data; name="f${i}"\r\n\r\n${i}\r\n`).join('')}--b--`
    expect(parseMultipart(Buffer.from(many), 'b')).toBeNull()
    expect(parseMultipart(Buffer.from(many), 'b', { maxParts: 64 })).toHaveLength(40)
  })

  it('finds the boundary parameter, quoted or not', () => {
    expect(boundaryOf('multipart/form-data; boundary=----abc123')).toBe('----abc123')
    expect(boundaryOf('multipart/form-data; charset=utf-8; boundary="a b"')).toBe('a b')
    expect(boundaryOf('multipart/form-data')).toBeNull()
  })
})
