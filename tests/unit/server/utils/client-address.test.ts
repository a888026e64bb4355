import { describe, expect, it } from 'vitest'
import { parseTrustedProxies, resolveClientAddress } from '../../../../server/utils/client-address'

// Addresses from the documentation ranges. source: RFC 5737 (192.0.2.0/24, 198.51.100.0/24, 203.0.113.0/24), RFC 3849 (2001:db8::/32)
describe('client address (NUXT_TRUSTED_PROXIES)', () => {
  it('ignores X-Forwarded-For when no proxy is trusted (the default)', () => {
    expect(resolveClientAddress('192.0.2.10', '203.0.113.5', parseTrustedProxies(''))).toBe('192.0.2.10')
  })

  it('takes the nearest untrusted hop when the socket is a trusted proxy', () => {
    const trusted = parseTrustedProxies('127.0.0.1, 10.0.0.0/8')
    expect(resolveClientAddress('127.0.0.1', '203.0.113.5', trusted)).toBe('203.0.113.5')
    // A client-written entry left of the real client is never believed.
    expect(resolveClientAddress('127.0.0.1', '198.51.100.1, 203.0.113.5', trusted)).toBe('203.0.113.5')
    // Two proxies in a row: both skipped.
    expect(resolveClientAddress('127.0.0.1', '203.0.113.5, 10.1.2.3', trusted)).toBe('203.0.113.5')
    // No header: the proxy itself.
    expect(resolveClientAddress('127.0.0.1', undefined, trusted)).toBe('127.0.0.1')
  })

  it('does not believe X-Forwarded-For from an untrusted socket, nor a hop that is not an address', () => {
    const trusted = parseTrustedProxies('127.0.0.1')
    expect(resolveClientAddress('192.0.2.10', '203.0.113.5', trusted)).toBe('192.0.2.10')
    expect(resolveClientAddress('127.0.0.1', 'not-an-address', trusted)).toBe('127.0.0.1')
  })

  it('treats IPv4 on an IPv6 socket as one address, and understands IPv6 ranges', () => {
    expect(resolveClientAddress('::ffff:192.0.2.10', undefined, null)).toBe('192.0.2.10')
    const trusted = parseTrustedProxies('2001:db8::/32')
    expect(resolveClientAddress('2001:db8::1', '2001:db9::7', trusted)).toBe('2001:db9::7')
  })

  it('refuses a setting that is neither an address nor a range, with a plain sentence', () => {
    expect(() => parseTrustedProxies('127.0.0.1, proxy.local')).toThrow(/"proxy.local" is not an IP address or a CIDR range/)
    expect(() => parseTrustedProxies('10.0.0.0/33')).toThrow(/CIDR/)
  })
})
