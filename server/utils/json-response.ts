import type { H3Event } from 'h3'
import { setResponseHeader } from 'h3'

/** Answers JSON text that is already written (e.g. by the analysis worker) as it is, without parsing and serialising it again. */
export function sendJsonText(event: H3Event, json: string): string {
  setResponseHeader(event, 'content-type', 'application/json; charset=utf-8')
  return json
}
