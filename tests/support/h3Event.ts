import { IncomingMessage, ServerResponse } from 'node:http'
import { Socket } from 'node:net'
import { createEvent, type H3Event } from 'h3'

/** Test builder: an h3 event for a request to `url` on `host` with these headers, no server needed. */
export function requestEvent(method: string, url: string, headers: Record<string, string> = {}, host = 'tonewright.example'): H3Event {
  const req = new IncomingMessage(new Socket())
  req.method = method
  req.url = url
  req.headers = { host, ...Object.fromEntries(Object.entries(headers).map(([k, v]) => [k.toLowerCase(), v])) }
  return createEvent(req, new ServerResponse(req))
}
