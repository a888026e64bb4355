import { describe, expect, it } from 'vitest'
import { CROSS_SITE, crossSiteProblem, NO_ORIGIN } from '../../../../server/utils/request-origin'
import { requestEvent } from '../../../support/h3Event'

const siteUrl = 'https://bench.tonewright.example'
const post = (headers: Record<string, string>) => requestEvent('POST', '/api/pieces', headers)

describe('crossSiteProblem', () => {
  it('passes a request from our own origin, by the address it came in on or the configured one', () => {
    // source: RFC 6454 §6.1, an origin serialises as scheme "://" host [":" port]
    expect(crossSiteProblem(post({ origin: 'http://tonewright.example' }), siteUrl)).toBeNull()
    expect(crossSiteProblem(post({ origin: 'https://bench.tonewright.example' }), siteUrl)).toBeNull()
    // source: RFC 6454 §4, scheme and host compare case-insensitively
    expect(crossSiteProblem(post({ origin: 'HTTPS://Bench.Tonewright.Example' }), siteUrl)).toBeNull()
  })

  it('refuses another origin, including our host on another port or scheme', () => {
    expect(crossSiteProblem(post({ origin: 'https://elsewhere.example' }), siteUrl)).toBe(CROSS_SITE)
    // source: RFC 6454 §5, origins differ when scheme, host or port differ
    expect(crossSiteProblem(post({ origin: 'http://bench.tonewright.example' }), siteUrl)).toBe(CROSS_SITE)
    expect(crossSiteProblem(post({ origin: 'https://bench.tonewright.example:8443' }), siteUrl)).toBe(CROSS_SITE)
    expect(crossSiteProblem(post({ origin: 'null' }), siteUrl)).toBe(CROSS_SITE)
  })

  it('falls back to Sec-Fetch-Site, where only same-origin passes', () => {
    // source: W3C Fetch Metadata Request Headers, Sec-Fetch-Site ∈ {cross-site, same-origin, same-site, none}
    expect(crossSiteProblem(post({ 'sec-fetch-site': 'same-origin' }), siteUrl)).toBeNull()
    for (const site of ['same-site', 'cross-site', 'none']) expect(crossSiteProblem(post({ 'sec-fetch-site': site }), siteUrl)).toBe(CROSS_SITE)
  })

  it('refuses the sign-in cookie without either header, and passes a bearer token or no credential', () => {
    expect(crossSiteProblem(post({ cookie: 'auth.token=abc' }), siteUrl)).toBe(NO_ORIGIN)
    expect(crossSiteProblem(post({ authorization: 'Bearer abc', origin: 'https://elsewhere.example' }), siteUrl)).toBeNull()
    expect(crossSiteProblem(post({}), siteUrl)).toBeNull()
  })

  it('still knows its own address when the configured one is unusable', () => {
    expect(crossSiteProblem(post({ origin: 'http://tonewright.example' }), 'not a url')).toBeNull()
    expect(crossSiteProblem(post({ origin: 'https://elsewhere.example' }), '')).toBe(CROSS_SITE)
  })
})
