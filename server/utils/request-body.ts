import type { H3Event } from 'h3'
import { getHeader } from 'h3'
import { fail } from './http-errors'

const RAW_BODY = Symbol.for('h3RawBody')
/** A strike of a few seconds is well under this; a longer declared body is not given its memory up front. */
const PREALLOCATE_MAX_BYTES = 8 * 1024 * 1024

/** Whether the request says it carries a body (a length above zero, or chunked). */
export function hasBody(event: H3Event): boolean {
  const length = Number.parseInt(getHeader(event, 'content-length') ?? '', 10)
  return (Number.isFinite(length) && length > 0) || /\bchunked\b/i.test(getHeader(event, 'transfer-encoding') ?? '')
}

/** Nitro's in-process requests (server-side rendering) carry their body already and have no socket to read. */
function isInternal(event: H3Event) {
  return '__unenv__' in event.node.req || 'body' in event.node.req
}

/**
 * Reads the request body into one Buffer, counting bytes as they arrive: a
 * declared length over the limit is refused before reading, and a body that
 * passes the limit while streaming (chunked, or longer than it said) is refused
 * at that moment: nothing more is kept (see refuseTooLarge).
 * The result is also left where h3's readBody/readMultipartFormData look for it.
 */
export async function readBodyLimited(event: H3Event, maxBytes: number, tooLarge: string): Promise<Buffer> {
  const req = event.node.req as typeof event.node.req & { [RAW_BODY]?: Promise<Buffer> }
  const cached = req[RAW_BODY]
  if (cached) return cached
  if (isInternal(event) || !hasBody(event)) return Buffer.alloc(0)
  const declared = Number.parseInt(getHeader(event, 'content-length') ?? '', 10)
  if (Number.isFinite(declared) && declared > maxBytes) refuseTooLarge(event, tooLarge)
  const body = new Promise<Buffer>((resolve, reject) => {
    // With a declared length the bytes stream straight into one buffer of that size; a
    // chunked body, or one declaring more than PREALLOCATE_MAX_BYTES (memory is held only
    // for bytes that came), collects its chunks and joins them at the end.
    const whole = Number.isFinite(declared) && declared > 0 && declared <= PREALLOCATE_MAX_BYTES ? Buffer.allocUnsafeSlow(declared) : null
    const chunks: Buffer[] = []
    let received = 0
    const cleanup = () => {
      req.off('data', onData)
      req.off('end', onEnd)
      req.off('error', onError)
      req.off('aborted', onAborted)
    }
    const onData = (chunk: Buffer) => {
      received += chunk.length
      if (received > maxBytes) {
        cleanup()
        chunks.length = 0
        try {
          refuseTooLarge(event, tooLarge)
        }
        catch (error) {
          reject(error)
        }
        return
      }
      if (!whole) chunks.push(chunk)
      else if (received <= whole.length) chunk.copy(whole, received - chunk.length)
      else onError(new Error('The request body is longer than its Content-Length.'))
    }
    const onEnd = () => {
      cleanup()
      // Always a fresh buffer holding only the body: a single socket chunk's memory can also hold the request's headers.
      resolve(whole ? whole.subarray(0, received) : Buffer.concat(chunks, received))
    }
    const onError = (error: Error) => {
      cleanup()
      reject(error)
    }
    const onAborted = () => onError(new Error('The request was aborted.'))
    req.on('data', onData).on('end', onEnd).on('error', onError).on('aborted', onAborted)
  })
  req[RAW_BODY] = body
  return body
}

/**
 * After a refusal, what the client still sends is read and thrown away (never
 * kept) until the answer is out, then up to this much more or this long; then
 * the connection is cut.
 */
const LINGER_BYTES = 64 * 1024 * 1024
const LINGER_MS = 10_000

/**
 * 413 now; nothing more of the body is kept. Cutting the connection at once
 * would reset it under a client still sending, and many clients (fetch among
 * them) then report a network error instead of the 413 (RFC 9112 §9.6), so the
 * rest is discarded as it comes, within LINGER_BYTES and LINGER_MS.
 */
export function refuseTooLarge(event: H3Event, sentence: string): never {
  discardRest(event)
  fail(413, sentence)
}

function discardRest(event: H3Event) {
  const { req, res } = event.node
  let answered = false
  let discardedAfterAnswer = 0
  const cut = () => {
    if (!req.complete) req.socket?.destroy()
  }
  req.on('data', (chunk: Buffer) => {
    if (!answered) return
    discardedAfterAnswer += chunk.length
    if (discardedAfterAnswer > LINGER_BYTES) cut()
  }).on('error', () => {})
  req.resume()
  res.once('finish', () => {
    answered = true
    setTimeout(cut, LINGER_MS).unref()
  })
}
