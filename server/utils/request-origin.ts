import type { H3Event } from 'h3'
import { getCookie, getHeader, getRequestURL } from 'h3'
import { TOKEN_COOKIE } from './auth'

export const CROSS_SITE = 'This request came from another site and was refused; open Tonewright at its own address and try again.'
export const NO_ORIGIN = 'This request did not say which page sent it and was refused; use Tonewright in a browser, or send the session token in an Authorization header.'

/** The origins of this app: the configured public address and the address the request came in on. */
function ownOrigins(event: H3Event, siteUrl: string): string[] {
  const origins = [getRequestURL(event).origin]
  try {
    if (siteUrl) origins.push(new URL(siteUrl).origin)
  }
  catch { /* an unusable NUXT_SITE_URL only removes one choice */ }
  return origins.map(o => o.toLowerCase())
}

/**
 * Why a state-changing request must be refused as cross-site, or null. A browser
 * sends the sign-in cookie with requests that other sites start, so a request
 * without an Authorization header must show, by `Origin` or `Sec-Fetch-Site`, that
 * one of our own pages sent it. A request with the cookie and neither header is
 * refused too. Bearer-token clients are not a browser's ambient credential and pass.
 */
export function crossSiteProblem(event: H3Event, siteUrl: string): string | null {
  if (getHeader(event, 'authorization')) return null
  const origin = getHeader(event, 'origin')
  if (origin !== undefined) return ownOrigins(event, siteUrl).includes(origin.trim().toLowerCase()) ? null : CROSS_SITE
  const site = getHeader(event, 'sec-fetch-site')
  if (site !== undefined) return site.trim().toLowerCase() === 'same-origin' ? null : CROSS_SITE
  let cookie: string | undefined
  try {
    cookie = getCookie(event, TOKEN_COOKIE)
  }
  catch {
    cookie = 'unreadable'
  }
  return cookie ? NO_ORIGIN : null
}
