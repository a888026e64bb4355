import { describe, expect, it } from 'vitest'
import { api, BASE_URL, newWorkshop } from '../support/http'

// Class guarded here: every HTML response carries the security headers, with a
// nonce-based Content-Security-Policy that allows only the app's own code.

async function page(path: string, token?: string) {
  const headers: Record<string, string> = { accept: 'text/html' }
  if (token) headers.cookie = `auth.token=${token}`
  const response = await fetch(`${BASE_URL}${path}`, { headers, redirect: 'manual' })
  return { status: response.status, headers: response.headers, html: await response.text() }
}

/** The directives of a Content-Security-Policy header, by name. */
function directives(csp: string | null): Record<string, string[]> {
  const out: Record<string, string[]> = {}
  for (const part of (csp ?? '').split(';').map(p => p.trim()).filter(Boolean)) {
    const [name, ...values] = part.split(/\s+/)
    out[name!] = values
  }
  return out
}

const OWN_SOURCES = /^('self'|'none'|'nonce-[\w+/=-]+'|data:|blob:|'unsafe-inline')$/

describe('security headers on every HTML response', () => {
  it('sign-in, verification, 404 and signed-in pages carry CSP, frame, sniffing and referrer headers', async () => {
    const owner = await newWorkshop('Header check')
    for (const [path, token] of [['/signin'], ['/verify/AAAAAAAAAAAAAAAA'], ['/no-such-page-here'], ['/pieces', owner.token], ['/', owner.token]] as const) {
      const p = await page(path, token)
      expect(p.status, path).toBe(path === '/no-such-page-here' ? 404 : 200)
      expect(p.headers.get('content-type')).toMatch(/text\/html/)
      const csp = directives(p.headers.get('content-security-policy'))
      // source: CSP Level 3 (W3C), 'frame-ancestors' and nonce sources
      expect(csp['frame-ancestors']).toEqual(['\'none\''])
      expect(csp['object-src']).toEqual(['\'none\''])
      expect(csp['base-uri']).toEqual(['\'none\''])
      expect(csp['script-src']).not.toContain('\'unsafe-inline\'')
      expect(csp['script-src']).not.toContain('\'unsafe-eval\'')
      expect(csp['script-src']!.some(s => s.startsWith('\'nonce-'))).toBe(true)
      for (const name of ['default-src', 'script-src', 'style-src', 'font-src', 'img-src', 'connect-src']) {
        expect(csp[name]!.every(s => OWN_SOURCES.test(s)), `${path} ${name}: ${csp[name]}`).toBe(true)
      }
      expect(csp['style-src']).not.toContain('\'unsafe-inline\'')
      expect(p.headers.get('x-content-type-options')).toBe('nosniff')
      expect(p.headers.get('referrer-policy')).toBe('same-origin')
      expect(p.headers.get('x-frame-options')).toBe('DENY')
      expect(p.headers.get('x-powered-by')).toBeNull()
    }
  })

  it('a redirect from the renderer carries the policy without a placeholder nonce', async () => {
    const p = await page('/pieces')
    expect([301, 302, 307]).toContain(p.status)
    const csp = p.headers.get('content-security-policy') ?? ''
    expect(csp).toContain('frame-ancestors \'none\'')
    expect(csp).not.toContain('{{')
  })

  it('every script of a page carries that response\'s nonce, and each response has its own', async () => {
    const a = await page('/signin')
    const b = await page('/signin')
    const nonceOf = (p: typeof a) => directives(p.headers.get('content-security-policy'))['script-src']!.find(s => s.startsWith('\'nonce-'))!.slice(7, -1)
    const nonce = nonceOf(a)
    expect(nonce.length).toBeGreaterThanOrEqual(16)
    expect(nonceOf(b)).not.toBe(nonce)
    const scripts = a.html.match(/<script\b[^>]*>/g) ?? []
    expect(scripts.length).toBeGreaterThan(0)
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`)
    // No inline event handlers for 'script-src-attr' to allow.
    expect(a.html).not.toMatch(/\son(click|load|error)=/i)
  })

  it('the Bench microphone worklet comes from our own origin as JavaScript', async () => {
    const reply = await fetch(`${BASE_URL}/worklets/tw-capture.js`)
    expect(reply.status).toBe(200)
    expect(reply.headers.get('content-type')).toMatch(/javascript/)
    expect(await reply.text()).toContain('registerProcessor(\'tw-capture\'')
    const csp = directives((await page('/signin')).headers.get('content-security-policy'))
    expect(csp['script-src']).toContain('\'self\'')
    expect(csp['script-src']).not.toContain('\'strict-dynamic\'')
  })

  it('API answers are not sniffed or framed either', async () => {
    const reply = await api('/api/health')
    expect(reply.headers.get('x-content-type-options')).toBe('nosniff')
    expect(reply.headers.get('x-frame-options')).toBe('DENY')
  })
})
