import type { H3Event } from 'h3'
import { getRequestURL } from 'h3'

/** The public address links point to: runtime config `siteUrl`, else the address this request came in on. */
export function siteUrlOf(event: H3Event): string {
  const configured = String(useRuntimeConfig().siteUrl ?? '').trim()
  return configured || getRequestURL(event).origin
}
