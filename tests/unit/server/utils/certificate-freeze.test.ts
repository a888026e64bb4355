import { describe, expect, it } from 'vitest'
import {
  certificateNumber, hashContent, latestOverrideByStrike, newVerificationCode, readinessProblem, supersessionProblem, verificationUrl,
} from '../../../../server/utils/certificate-freeze'

describe('hashContent', () => {
  it('is the SHA-256 of the canonical JSON, in hex', () => {
    // source: GNU coreutils `printf '{}' | sha256sum`
    expect(hashContent({})).toBe('44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a')
    // source: GNU coreutils `printf '{"a":1,"b":[2,3]}' | sha256sum`
    expect(hashContent({ b: [2, 3], a: 1 })).toBe('efbd0040190fb0871831e606c581f8a66db79d8e2bb836745a70051306956070')
  })

  it('does not depend on key order, and changes with any value', () => {
    expect(hashContent({ a: { x: 1, y: 2 }, b: 'c' })).toBe(hashContent({ b: 'c', a: { y: 2, x: 1 } }))
    expect(hashContent({ a: 1 })).not.toBe(hashContent({ a: 2 }))
  })
})

describe('verification code and address', () => {
  it('draws 96 random bits as 16 URL-safe characters', () => {
    // source: RFC 4648 §5 (base64url: 12 bytes → 16 characters from A–Z a–z 0–9 - _, no padding)
    const codes = new Set(Array.from({ length: 50 }, () => newVerificationCode()))
    expect(codes.size).toBe(50)
    for (const code of codes) expect(code).toMatch(/^[\w-]{16}$/)
  })

  it('puts the code under /verify/ of the site, whatever trailing slashes the site has', () => {
    expect(verificationUrl('https://tonewright.example/', 'abc')).toBe('https://tonewright.example/verify/abc')
    expect(verificationUrl('https://tonewright.example//', 'abc')).toBe('https://tonewright.example/verify/abc')
    expect(verificationUrl('http://127.0.0.1:3000', 'abc')).toBe('http://127.0.0.1:3000/verify/abc')
  })

  it('numbers certificates per year with four digits, and lets the serial grow past them', () => {
    expect(certificateNumber(2026, 1)).toBe('TW-2026-0001')
    expect(certificateNumber(2026, 42)).toBe('TW-2026-0042')
    expect(certificateNumber(2027, 12345)).toBe('TW-2027-12345')
  })
})

describe('supersessionProblem', () => {
  const valid = { id: 'c-2', number: 'TW-2026-0002' }

  it('lets a first signing through and refuses one over a valid certificate', () => {
    expect(supersessionProblem(null, null, null)).toBeNull()
    expect(supersessionProblem(valid, null, null)).toBe('This set already has a valid certificate (TW-2026-0002). To replace it, re-issue that certificate with a reason.')
  })

  it('lets a re-issue of the current certificate through', () => {
    expect(supersessionProblem(valid, { id: 'c-2', reason: 'buyer moved' }, null)).toBeNull()
  })

  it('refuses a re-issue of a superseded or revoked certificate, naming what to do instead', () => {
    expect(supersessionProblem(valid, { id: 'c-1', reason: 'r' }, { status: 'superseded', number: 'TW-2026-0001' }))
      .toBe('Certificate TW-2026-0001 has already been superseded by TW-2026-0002; re-issue the current one.')
    expect(supersessionProblem(null, { id: 'c-1', reason: 'r' }, { status: 'revoked', number: 'TW-2026-0001' }))
      .toBe('Certificate TW-2026-0001 is revoked and cannot be re-issued; sign the set again instead.')
    expect(supersessionProblem(null, { id: 'c-1', reason: 'r' }, { status: 'superseded', number: 'TW-2026-0001' }))
      .toBe('Certificate TW-2026-0001 has already been superseded; re-issue the current one.')
  })
})

describe('readinessProblem', () => {
  const piece = (note: string, stage: string, approvedStrikeId: string | null = 's') => ({ note, stage, approvedStrikeId })

  it('accepts a set whose live pieces are all approved (or already certified or shipped)', () => {
    expect(readinessProblem([piece('C5', 'approved'), piece('D5', 'certified'), piece('E5', 'shipped')])).toBeNull()
  })

  it('refuses an empty set', () => {
    expect(readinessProblem([])).toBe('This set has no pieces to certify.')
  })

  it('names at most five pieces still to approve and counts them all', () => {
    const notes = ['C5', 'D5', 'E5', 'F5', 'G5', 'A5', 'B5']
    expect(readinessProblem([piece('B4', 'approved'), ...notes.map(n => piece(n, 'tuning'))]))
      .toBe('Not every piece is approved yet (7 left: C5, D5, E5, F5, G5, …).')
    expect(readinessProblem([piece('C5', 'review'), piece('D5', 'approved')])).toBe('Not every piece is approved yet (1 left: C5).')
  })

  it('refuses an approved piece without its approved strike', () => {
    expect(readinessProblem([piece('C5', 'approved', null)])).toBe('A piece has no approved strike; reopen and approve it again.')
  })

  it('waits for approvals that can still be undone, naming them', () => {
    const pending = (note: string) => ({ ...piece(note, 'approved'), approvalPending: true })
    expect(readinessProblem([piece('C5', 'approved'), pending('D5')]))
      .toBe('D5 was approved moments ago and can still be undone; sign in a few seconds.')
    expect(readinessProblem([pending('C5'), pending('D5')]))
      .toBe('C5, D5 were approved moments ago and can still be undone; sign in a few seconds.')
    expect(readinessProblem([{ ...piece('C5', 'approved'), approvalPending: false }])).toBeNull()
  })
})

describe('latestOverrideByStrike', () => {
  it('keeps the first (newest) reason per strike and skips reviews without a strike', () => {
    const map = latestOverrideByStrike([
      { strikeId: 's1', reason: 'newest' },
      { strikeId: null, reason: 'returned' },
      { strikeId: 's1', reason: 'older' },
      { strikeId: 's2', reason: null },
    ])
    expect([...map]).toEqual([['s1', 'newest'], ['s2', null]])
  })
})
