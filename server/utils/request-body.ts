import type { H3Event } from 'h3'
import { getHeader } from 'h3'
import { fail } from './http-errors'

const RAW_BODY = Symbol.for('h3RawBody')

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
 * at that moment: nothing more is kept, and the connection closes after the 413.
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
      chunks.push(chunk)
    }
    const onEnd = () => {
      cleanup()
      resolve(chunks.length === 1 ? chunks[0]! : Buffer.concat(chunks, received))
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

/** After a refusal the connection stays open this long, so the client can read the 413, and is then cut. */
const LINGER_MS = 1500

/**
 * 413 now, and nothing more is read: the request is paused (the client's writes
 * stall once the socket buffers fill), the answer goes out, and the connection is
 * cut LINGER_MS after it. Cutting at once would reset the connection under a
 * client still sending, which then might never see the 413 (RFC 9112 §9.6).
 */
export function refuseTooLarge(event: H3Event, sentence: string): never {
  stopReading(event)
  fail(413, sentence)
}

function stopReading(event: H3Event) {
  const { req, res } = event.node
  // A listener marks the body as consumed, so Node does not drain it after the answer; the pause stops the socket.
  req.on('data', () => {}).on('error', () => {})
  req.pause()
  res.once('finish', () => {
    setTimeout(() => {
      if (!req.complete) req.socket?.destroy()
    }, LINGER_MS).unref()
  })
}
