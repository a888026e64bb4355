import { describe, expect, it } from 'vitest'
import { acceptsType, BODY_LIMITS, bodyPolicy, sizeText } from '../../../../server/utils/request-limits'
import { LIMITS } from '../../../../shared/analysis/limits'

describe('bodyPolicy', () => {
  it('takes multipart only on the upload routes, with room for the form around 50 MB', () => {
    expect(bodyPolicy('POST', '/api/pieces/5b1e1c7e-0000-4000-8000-000000000000/strikes')).toEqual({ kind: 'upload', maxBytes: BODY_LIMITS.uploadBytes })
    expect(bodyPolicy('POST', '/api/analyze').kind).toBe('upload')
    expect(bodyPolicy('PUT', '/api/analyze').kind).toBe('json')
    expect(bodyPolicy('POST', '/api/calibrations').kind).toBe('upload')
    expect(bodyPolicy('POST', '/api/pieces/x/strikes/extra').kind).toBe('json')
    expect(BODY_LIMITS.uploadBytes).toBeGreaterThan(LIMITS.maxBytes)
    expect(BODY_LIMITS.uploadBytes - LIMITS.maxBytes).toBeLessThanOrEqual(1024 * 1024)
  })

  it('takes JSON or, by its Content-Type, a multipart recording on the blank-grading route', () => {
    expect(bodyPolicy('POST', '/api/blanks/grade', 'application/json').kind).toBe('json')
    expect(bodyPolicy('POST', '/api/blanks/grade').kind).toBe('json')
    expect(bodyPolicy('POST', '/api/blanks/grade', 'multipart/form-data; boundary=x')).toEqual({ kind: 'upload', maxBytes: BODY_LIMITS.uploadBytes })
    expect(bodyPolicy('POST', '/api/cut-plan', 'multipart/form-data; boundary=x').kind).toBe('json')
  })

  it('gives public routes 64 kB and signed-in routes 1 MB', () => {
    for (const path of ['/api/auth/login', '/api/auth/signup', '/api/invitations/accept', '/api/verify/abc']) expect(bodyPolicy('POST', path).maxBytes).toBe(64 * 1024)
    for (const path of ['/api/lots', '/api/sets', '/api/templates/x', '/api/authx']) expect(bodyPolicy('POST', path).maxBytes).toBe(1024 * 1024)
  })
})

describe('acceptsType', () => {
  it('accepts JSON (with parameters, or a +json type) on JSON routes and nothing else', () => {
    expect(acceptsType('json', 'application/json')).toBe(true)
    expect(acceptsType('json', 'Application/JSON; charset=utf-8')).toBe(true)
    expect(acceptsType('json', 'application/merge-patch+json')).toBe(true)
    for (const type of ['application/x-www-form-urlencoded', 'text/plain', 'multipart/form-data; boundary=x', undefined, '']) expect(acceptsType('json', type)).toBe(false)
  })

  it('accepts only multipart/form-data on upload routes', () => {
    expect(acceptsType('upload', 'multipart/form-data; boundary=abc')).toBe(true)
    expect(acceptsType('upload', 'application/json')).toBe(false)
    expect(acceptsType('upload', 'multipart/mixed; boundary=abc')).toBe(false)
  })

  it('writes sizes for messages', () => {
    expect(sizeText(64 * 1024)).toBe('64 kB')
    expect(sizeText(1024 * 1024)).toBe('1 MB')
  })
})
