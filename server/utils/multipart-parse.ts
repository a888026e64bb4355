/** One part of a multipart/form-data body; `data` is a view into the body, not a copy. */
export interface FormPart { name: string, filename?: string, type?: string, data: Buffer }

const CRLF = Buffer.from('\r\n')
const HEADER_END = Buffer.from('\r\n\r\n')
const MAX_HEADER_BYTES = 8 * 1024

/** The boundary parameter of a multipart Content-Type, or null. */
export function boundaryOf(contentType: string): string | null {
  const match = /;\s*boundary=(?:"([^"]{1,70})"|([^;\s]{1,70}))/i.exec(contentType)
  return match ? (match[1] ?? match[2]!) : null
}

/** A parameter of a Content-Disposition header (quoted or not), decoded as UTF-8 the way browsers send it. */
function parameter(header: string, key: string): string | undefined {
  const match = new RegExp(`;\\s*${key}=(?:"((?:[^"\\\\]|\\\\.)*)"|([^;\\s]*))`, 'i').exec(header)
  if (!match) return undefined
  const raw = match[1] !== undefined ? match[1].replace(/\\(.)/g, '$1') : match[2]!
  return Buffer.from(raw, 'latin1').toString('utf8')
}

/**
 * Splits a complete multipart/form-data body (RFC 7578) at its boundaries with
 * Buffer.indexOf: linear in the body's size and without copying part data.
 * Returns null for a body that is not well-formed or has more than `maxParts` parts.
 */
export function parseMultipart(body: Buffer, boundary: string, options: { maxParts?: number } = {}): FormPart[] | null {
  if (!boundary) return null
  const maxParts = options.maxParts ?? 32
  const delimiter = Buffer.from(`--${boundary}`)
  const next = Buffer.from(`\r\n--${boundary}`)
  // The first delimiter opens the body or follows a preamble line.
  let at = body.subarray(0, delimiter.length).equals(delimiter) ? 0 : body.indexOf(next)
  if (at < 0) return null
  if (at > 0) at += CRLF.length
  const parts: FormPart[] = []
  for (;;) {
    let cursor = at + delimiter.length
    if (body[cursor] === 0x2D && body[cursor + 1] === 0x2D) return parts
    // Transport padding (spaces, tabs) may follow a delimiter before its line break.
    while (body[cursor] === 0x20 || body[cursor] === 0x09) cursor++
    if (body[cursor] !== 0x0D || body[cursor + 1] !== 0x0A) return null
    cursor += CRLF.length
    const headerEnd = body.indexOf(HEADER_END, cursor)
    if (headerEnd < 0 || headerEnd - cursor > MAX_HEADER_BYTES) return null
    const end = body.indexOf(next, headerEnd + HEADER_END.length)
    if (end < 0 || parts.length >= maxParts) return null
    const headers = body.toString('latin1', cursor, headerEnd).split('\r\n')
    const disposition = headers.find(h => /^content-disposition\s*:/i.test(h)) ?? ''
    const type = headers.find(h => /^content-type\s*:/i.test(h))?.replace(/^[^:]*:\s*/, '').trim()
    const name = parameter(disposition, 'name')
    if (name === undefined || !/^content-disposition\s*:\s*form-data\b/i.test(disposition)) return null
    parts.push({ name, filename: parameter(disposition, 'filename'), type, data: body.subarray(headerEnd + HEADER_END.length, end) })
    at = end + CRLF.length
  }
}
