import { IncomingMessage, ServerResponse } from 'node:http'
import { Socket } from 'node:net'
import { createEvent, type H3Event } from 'h3'

/**
 * Test builder: an h3 event for a request to `url` on `host` with these headers, no server
 * needed. With `body`, the request's stream delivers those chunks and ends.
 */
export function requestEvent(method: string, url: string, headers: Record<string, string> = {}, body?: (string | Uint8Array)[]): H3Event {
  const req = new IncomingMessage(new Socket())
  req.method = method
  req.url = url
  req.headers = { host: 'tonewright.example', ...Object.fromEntries(Object.entries(headers).map(([k, v]) => [k.toLowerCase(), v])) }
  if (body) {
    for (const chunk of body) req.push(Buffer.from(chunk))
    req.push(null)
  }
  return createEvent(req, new ServerResponse(req))
}
