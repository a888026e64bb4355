import bcrypt from 'bcryptjs'
import { describe, expect, it } from 'vitest'
import { checkPassword, hashPassword } from '../../../../server/utils/passwords'

describe('passwords', () => {
  it('stores a salted bcrypt hash that the password, and only it, matches', async () => {
    const hash = await hashPassword('bar-and-bell-2026')
    // source: bcrypt modular crypt format "$2a$" / "$2b$", cost, 22-character salt + 31-character hash = 60 characters (from memory)
    expect(hash).toMatch(/^\$2[aby]\$10\$[./A-Za-z0-9]{53}$/)
    expect(await hashPassword('bar-and-bell-2026')).not.toBe(hash)
    expect(await checkPassword('bar-and-bell-2026', hash)).toBe(true)
    expect(await checkPassword('bar-and-bell-2027', hash)).toBe(false)
    // The reference library agrees with what was stored.
    expect(await bcrypt.compare('bar-and-bell-2026', hash)).toBe(true)
  }, 30_000) // bcrypt is slow on purpose: five hashes at cost 10

  it('answers false for an unknown member, whatever the password', async () => {
    expect(await checkPassword('not-a-real-password-tonewright', null)).toBe(false)
    expect(await checkPassword('anything', undefined)).toBe(false)
  })
})
