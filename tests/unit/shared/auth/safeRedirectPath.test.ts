import { describe, expect, it } from 'vitest'
import { safeRedirectPath } from '../../../../shared/auth/safeRedirectPath'

describe('safeRedirectPath', () => {
  it('keeps a path of this site, with its query', () => {
    expect(safeRedirectPath('/pieces/8f1c?tab=strikes')).toBe('/pieces/8f1c?tab=strikes')
    expect(safeRedirectPath('/')).toBe('/')
  })

  it('sends every address of another site home', () => {
    // A browser reads '//host' and '/\host' as protocol-relative addresses (source: WHATWG URL
    // Standard, "special authority slashes" state, which treats '\' as '/' for http(s)).
    for (const asked of ['//evil.example', '/\\evil.example', '/\\/evil.example', 'https://evil.example', 'javascript:alert(1)', 'evil.example', '/%0d%0a\r\nSet-Cookie:x', '/\tfoo', ' /pieces']) {
      expect(safeRedirectPath(asked), asked).toBe('/')
    }
  })

  it('sends anything that is not one string home', () => {
    for (const asked of [undefined, null, ['/a', '/b'], 42, `/${'a'.repeat(2001)}`]) expect(safeRedirectPath(asked)).toBe('/')
  })
})
