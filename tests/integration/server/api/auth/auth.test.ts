import { describe, expect, it } from 'vitest'
import { api, newWorkshop, uniqueEmail } from '../../../support/http'

describe('sign-up, sign-in and sign-out', () => {
  it('signs up a workshop owner who can then sign in and see the session', async () => {
    const { email, password, workshopId } = await newWorkshop('Sign-up workshop')
    const login = await api('/api/auth/login', { method: 'POST', body: { email, password } })
    expect(login.status).toBe(200)
    expect(typeof login.body.token).toBe('string')
    const session = await api('/api/auth/session', { token: login.body.token })
    expect(session.status).toBe(200)
    expect(session.body).toMatchObject({ email, workshopId, role: 'owner', workshopName: 'Sign-up workshop' })
    expect(session.body.workshops).toHaveLength(1)
  })

  it('accepts the token from the auth cookie as well as the header', async () => {
    const { token } = await newWorkshop()
    const session = await api('/api/auth/session', { headers: { cookie: `auth.token=${encodeURIComponent(`Bearer ${token}`)}` } })
    expect(session.status).toBe(200)
  })

  it('signs out: the token stops working', async () => {
    const { token } = await newWorkshop()
    expect((await api('/api/auth/logout', { method: 'POST', token })).status).toBe(200)
    const after = await api('/api/auth/session', { token })
    expect(after.status).toBe(401)
  })

  it('answers a wrong password exactly as an unknown e-mail', async () => {
    const { email } = await newWorkshop()
    const wrong = await api('/api/auth/login', { method: 'POST', body: { email, password: 'not-the-password' } })
    const unknown = await api('/api/auth/login', { method: 'POST', body: { email: uniqueEmail('nobody'), password: 'not-the-password' } })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body.message).toBe(unknown.body.message)
    expect(wrong.body.message).not.toMatch(/exist|unknown|not found/i)
  })

  it('rate-limits an account after repeated failures, for known and unknown e-mails alike', async () => {
    const { email, password } = await newWorkshop()
    const nobody = uniqueEmail('nobody')
    const statuses: number[] = []
    const unknownStatuses: number[] = []
    for (let i = 0; i < 9; i++) {
      statuses.push((await api('/api/auth/login', { method: 'POST', body: { email, password: 'wrong-wrong' } })).status)
      unknownStatuses.push((await api('/api/auth/login', { method: 'POST', body: { email: nobody, password: 'wrong-wrong' } })).status)
    }
    // 8 failures per account in 15 minutes (server/utils/rate-limit.ts); the 9th is refused.
    expect(statuses.slice(0, 8)).toEqual(Array(8).fill(401))
    expect(statuses[8]).toBe(429)
    expect(unknownStatuses).toEqual(statuses)
    const blocked = await api('/api/auth/login', { method: 'POST', body: { email, password } })
    expect(blocked.status).toBe(429)
    expect(blocked.body.message).toMatch(/Too many sign-in attempts/)
  })

  it('refuses a second sign-up with the same e-mail and saves nothing', async () => {
    const { email } = await newWorkshop()
    const again = await api('/api/auth/signup', { method: 'POST', body: { name: 'X', email, password: 'another-password', workshopName: 'Second' } })
    expect(again.status).toBe(409)
  })

  it('explains bad sign-up input in a plain sentence with 400', async () => {
    const reply = await api('/api/auth/signup', { method: 'POST', body: { name: 'X', email: 'not-an-email', password: 'short', workshopName: 'W' } })
    expect(reply.status).toBe(400)
    expect(reply.body.message).toMatch(/e-mail/i)
    expect(JSON.stringify(reply.body)).not.toMatch(/at .*\.js:\d+/)
  })

  it('answers 401 without a token and for a made-up one', async () => {
    expect((await api('/api/auth/session')).status).toBe(401)
    expect((await api('/api/team', { token: 'made-up-token' })).status).toBe(401)
  })

  it('lets a user open a second workshop and switch to it', async () => {
    const { token } = await newWorkshop('First shop')
    const created = await api('/api/workshops', { method: 'POST', token, body: { name: 'Second shop' } })
    expect(created.status).toBe(201)
    const switched = await api('/api/auth/workshop', { method: 'POST', token, body: { workshopId: created.body.id } })
    expect(switched.status).toBe(200)
    const session = await api('/api/auth/session', { token })
    expect(session.body.workshopName).toBe('Second shop')
    expect(session.body.workshops.map((w: { name: string }) => w.name).sort()).toEqual(['First shop', 'Second shop'])
  })

  it('will not switch to a workshop the user is not a member of', async () => {
    const a = await newWorkshop()
    const b = await newWorkshop()
    const reply = await api('/api/auth/workshop', { method: 'POST', token: a.token, body: { workshopId: b.workshopId } })
    expect(reply.status).toBe(404)
  })
})
