import { afterAll, describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop, signIn, uniqueEmail } from '../../../support/http'
import { mailTo, testSql, until, waitForMailTo } from '../../../support/mail'

const tokenIn = (text: string, path: string) => new RegExp(`${path}\\?token=([\\w-]+)`).exec(text)?.[1]

afterAll(async () => {
  await testSql().end()
})

describe('invitations', () => {
  it('e-mails a single-use sign-up link; the invited person joins with the role', async () => {
    const owner = await newWorkshop('Copperleaf Chimes')
    const email = uniqueEmail('invited')
    const invited = await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { name: 'Mira Stenholt', email, role: 'supervisor' } })
    expect(invited.status).toBe(201)
    expect(JSON.stringify(invited.body)).not.toMatch(/token/i)
    const message = await waitForMailTo(email)
    expect(message.subject).toContain('Copperleaf Chimes')
    const token = tokenIn(message.text, '/join')!
    expect(token).toBeTruthy()
    const [stored] = await testSql()`select token_hash from invitations where id = ${invited.body.id}`
    expect(stored!.token_hash).not.toBe(token)

    const lookup = await api('/api/invitations/lookup', { method: 'POST', body: { token } })
    expect(lookup.status).toBe(200)
    expect(lookup.body).toMatchObject({ workshopName: 'Copperleaf Chimes', email, role: 'supervisor', hasAccount: false })
    const accepted = await api('/api/invitations/accept', { method: 'POST', body: { token, name: 'Mira Stenholt', password: 'bell-metal-rings-true' } })
    expect(accepted.status).toBe(200)
    const session = await api('/api/auth/session', { token: await signIn(email, 'bell-metal-rings-true') })
    expect(session.body.role).toBe('supervisor')
    expect(session.body.workshopName).toBe('Copperleaf Chimes')

    const again = await api('/api/invitations/accept', { method: 'POST', body: { token, name: 'Someone', password: 'another-password-1' } })
    expect(again.status).toBe(404)
    expect(again.body.message).toMatch(/expired or was already used/)
    expect((await api('/api/invitations/lookup', { method: 'POST', body: { token } })).status).toBe(404)
  })

  it('an expired invitation no longer opens; only the owner invites; members are not invited twice', async () => {
    const owner = await newWorkshop()
    const email = uniqueEmail('late')
    const invited = await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { email, role: 'office' } })
    const token = tokenIn((await waitForMailTo(email)).text, '/join')!
    await testSql()`update invitations set expires_at = now() - interval '1 minute' where id = ${invited.body.id}`
    expect((await api('/api/invitations/lookup', { method: 'POST', body: { token } })).status).toBe(404)
    expect((await api('/api/invitations/accept', { method: 'POST', body: { token, name: 'Late', password: 'too-late-password' } })).status).toBe(404)

    const office = await memberWithRole(owner.token, 'office')
    expect((await api('/api/team/invitations', { method: 'POST', token: office.token, body: { email: uniqueEmail(), role: 'owner' } })).status).toBe(403)
    expect((await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { email: office.email, role: 'office' } })).status).toBe(409)
    expect((await api('/api/team/invitations', { method: 'POST', token: owner.token, body: { email: 'not-an-address', role: 'office' } })).status).toBe(400)
    expect((await api('/api/invitations/accept', { method: 'POST', body: { token: 'x', name: 'A', password: 'whatever-password' } })).status).toBe(400)
  })
})

describe('password reset', () => {
  it('answers the same for a known and an unknown address, and mails only the known one', async () => {
    const owner = await newWorkshop()
    const unknown = uniqueEmail('nobody')
    const known = await api('/api/auth/forgot-password', { method: 'POST', body: { email: owner.email } })
    const other = await api('/api/auth/forgot-password', { method: 'POST', body: { email: unknown } })
    expect(known.status).toBe(200)
    expect(other.status).toBe(known.status)
    expect(other.body).toEqual(known.body)
    await waitForMailTo(owner.email)
    // Give the queue time to have sent anything it was going to send.
    await new Promise(r => setTimeout(r, 3000))
    expect(await mailTo(unknown)).toHaveLength(0)
  })

  it('sets a new password once, ends the old sessions, and refuses a used or expired link', async () => {
    const owner = await newWorkshop()
    await api('/api/auth/forgot-password', { method: 'POST', body: { email: owner.email } })
    const token = tokenIn((await waitForMailTo(owner.email)).text, '/reset-password')!
    expect(token).toBeTruthy()
    const reset = await api('/api/auth/reset-password', { method: 'POST', body: { token, password: 'a-brand-new-password' } })
    expect(reset.status).toBe(200)
    expect((await api('/api/auth/session', { token: owner.token })).status).toBe(401)
    expect((await api('/api/auth/login', { method: 'POST', body: { email: owner.email, password: owner.password } })).status).toBe(401)
    await signIn(owner.email, 'a-brand-new-password')
    const reuse = await api('/api/auth/reset-password', { method: 'POST', body: { token, password: 'yet-another-password' } })
    expect(reuse.status).toBe(400)
    expect(reuse.body.message).toMatch(/expired or was already used/)

    await api('/api/auth/forgot-password', { method: 'POST', body: { email: owner.email } })
    const second = await until('a second reset mail', async () => {
      const mails = await mailTo(owner.email)
      return mails.length >= 2 ? mails[mails.length - 1] : null
    })
    const late = tokenIn(second.text, '/reset-password')!
    await testSql()`update password_resets set expires_at = now() - interval '1 second' where used_at is null and user_id = ${owner.userId}`
    expect((await api('/api/auth/reset-password', { method: 'POST', body: { token: late, password: 'expired-link-password' } })).status).toBe(400)
    await signIn(owner.email, 'a-brand-new-password')
  })
})

describe('password reset limits', () => {
  it('sends at most three links an hour to one account, answering the same every time', async () => {
    const owner = await newWorkshop()
    const answers = []
    for (let i = 0; i < 5; i++) answers.push(await api('/api/auth/forgot-password', { method: 'POST', body: { email: owner.email } }))
    expect(answers.map(a => a.status)).toEqual([200, 200, 200, 200, 200])
    expect(new Set(answers.map(a => JSON.stringify(a.body))).size).toBe(1)
    const [{ n }] = await testSql()`select count(*)::int as n from password_resets r join users u on u.id = r.user_id where u.email = ${owner.email}`
    expect(n).toBe(3)
  })

  it('refuses the ninth request for one address within 15 minutes, known or not', async () => {
    const owner = await newWorkshop()
    const nobody = uniqueEmail('nobody')
    const known: number[] = []
    const unknown: number[] = []
    for (let i = 0; i < 9; i++) {
      known.push((await api('/api/auth/forgot-password', { method: 'POST', body: { email: owner.email } })).status)
      unknown.push((await api('/api/auth/forgot-password', { method: 'POST', body: { email: nobody } })).status)
    }
    // 8 per e-mail in 15 minutes (server/utils/rate-limit.ts), the same for both.
    expect(known).toEqual([...Array(8).fill(200), 429])
    expect(unknown).toEqual(known)
  })
})
