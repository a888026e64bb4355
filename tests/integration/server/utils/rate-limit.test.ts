import { randomUUID } from 'node:crypto'
import { afterAll, describe, expect, it } from 'vitest'
import { createDatabase } from '../../../../server/database/client'
import { isSignInBlocked, recordFailedSignIn } from '../../../../server/utils/rate-limit'

// Against the real test database: the per-address limit that HTTP tests cannot
// reach without blocking each other (they all come from 127.0.0.1).
const { db, client } = createDatabase(process.env.NUXT_DATABASE_URL!, { max: 2 })
afterAll(() => client.end())

describe('sign-in limits', () => {
  it('blocks an address after its failures across many e-mails, and only that address', async () => {
    const ip = `198.51.100.${Math.floor(Math.random() * 250)}-${randomUUID().slice(0, 4)}`
    const limits = { windowS: 900, maxPerAddress: 5, maxPerAccount: 8 }
    for (let i = 0; i < 4; i++) await recordFailedSignIn(db, ip, `${randomUUID()}@example.test`)
    expect(await isSignInBlocked(db, ip, 'fresh@example.test', limits)).toBe(false)
    await recordFailedSignIn(db, ip, `${randomUUID()}@example.test`)
    expect(await isSignInBlocked(db, ip, 'fresh@example.test', limits)).toBe(true)
    expect(await isSignInBlocked(db, `${ip}-other`, 'fresh@example.test', limits)).toBe(false)
  })

  it('forgets failures older than the window', async () => {
    const ip = `203.0.113.9-${randomUUID().slice(0, 4)}`
    for (let i = 0; i < 3; i++) await recordFailedSignIn(db, ip, 'old@example.test')
    await client`update login_attempts set at = now() - interval '20 minutes' where ip = ${ip}`
    expect(await isSignInBlocked(db, ip, 'old@example.test', { windowS: 900, maxPerAddress: 3, maxPerAccount: 3 })).toBe(false)
  })
})
