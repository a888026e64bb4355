import { describe, expect, it } from 'vitest'
import { api, memberWithRole, newWorkshop } from '../../../support/http'

const URL = '/api/workshops/current/settings'

describe('workshop settings', () => {
  it('starts at UTC, °C and A = 440 Hz, and the owner changes them', async () => {
    const owner = await newWorkshop('Settings check works')
    const first = await api(URL, { token: owner.token })
    expect(first.status).toBe(200)
    expect(first.body).toEqual({ timeZone: 'UTC', locale: 'en-GB', temperatureUnit: 'C', referenceHz: 440, calibrationValidDays: 90, repeatStrikesBeforeReview: false })
    const changed = await api(URL, { method: 'PATCH', token: owner.token, body: { timeZone: 'Europe/Berlin', locale: 'de-DE', temperatureUnit: 'F', referenceHz: 442, calibrationValidDays: 30, repeatStrikesBeforeReview: true } })
    expect(changed.status).toBe(200)
    expect(changed.body).toEqual({ timeZone: 'Europe/Berlin', locale: 'de-DE', temperatureUnit: 'F', referenceHz: 442, calibrationValidDays: 30, repeatStrikesBeforeReview: true })
    // A partial change keeps the rest.
    const pitch = await api(URL, { method: 'PATCH', token: owner.token, body: { referenceHz: 443 } })
    expect(pitch.body).toMatchObject({ timeZone: 'Europe/Berlin', referenceHz: 443 })
    // Every member reads them (times are shown in the workshop's zone), and the session carries them.
    const bench = await memberWithRole(owner.token, 'benchmaker')
    expect((await api(URL, { token: bench.token })).body.timeZone).toBe('Europe/Berlin')
    expect((await api('/api/auth/session', { token: bench.token })).body.settings).toMatchObject({ timeZone: 'Europe/Berlin', locale: 'de-DE', temperatureUnit: 'F' })
  })

  it('answers 403 to every role but the owner, and changes nothing', async () => {
    const owner = await newWorkshop()
    for (const role of ['supervisor', 'benchmaker', 'office']) {
      const member = await memberWithRole(owner.token, role)
      const reply = await api(URL, { method: 'PATCH', token: member.token, body: { timeZone: 'Asia/Tokyo' } })
      expect(reply.status, role).toBe(403)
    }
    expect((await api(URL, { token: owner.token })).body.timeZone).toBe('UTC')
    expect((await api(URL, {})).status).toBe(401)
  })

  it('answers 400 with a plain sentence to a bad zone, locale, unit or pitch, and saves nothing of the request', async () => {
    const owner = await newWorkshop()
    const bad: [Record<string, unknown>, RegExp][] = [
      [{ timeZone: 'Mars/Olympus_Mons' }, /time zone/i],
      [{ timeZone: 'Europe/Berlin', locale: 'english please' }, /language/i],
      [{ temperatureUnit: 'K' }, /°C or °F/],
      // The pitch range the workshop default may take: A = 415 Hz (a semitone low) to 466 Hz (a semitone high). // common practice
      [{ timeZone: 'Europe/Berlin', referenceHz: 414.9 }, /415.*466/],
      [{ referenceHz: 500 }, /415.*466/],
      [{ referenceHz: 'high' }, /number/i],
      [{ repeatStrikesBeforeReview: 'yes' }, /three strikes/i],
      [{}, /nothing to change/i],
      [{ timeZone: 'UTC', colour: 'red' }, /colour/],
      [{ calibrationValidDays: 0 }, /1 and 3650 days/],
      [{ timeZone: 'Europe/Berlin', calibrationValidDays: 3651 }, /1 and 3650 days/],
      [{ calibrationValidDays: 7.5 }, /whole number/],
      [{ calibrationValidDays: '30' }, /number of days/],
    ]
    for (const [body, message] of bad) {
      const reply = await api(URL, { method: 'PATCH', token: owner.token, body })
      expect(reply.status, JSON.stringify(body)).toBe(400)
      expect(JSON.stringify(reply.body), JSON.stringify(body)).toMatch(message)
    }
    expect((await api(URL, { token: owner.token })).body).toEqual({ timeZone: 'UTC', locale: 'en-GB', temperatureUnit: 'C', referenceHz: 440, calibrationValidDays: 90, repeatStrikesBeforeReview: false })
  })

  it('refuses an oversized body before reading it', async () => {
    const owner = await newWorkshop()
    const reply = await api(URL, { method: 'PATCH', token: owner.token, body: { timeZone: 'UTC', padding: 'x'.repeat(2_000_000) } })
    expect(reply.status).toBe(413)
  })

  it('keeps one workshop\'s settings from another: the owner of one changes only their own', async () => {
    const a = await newWorkshop('Workshop A')
    const b = await newWorkshop('Workshop B')
    await api(URL, { method: 'PATCH', token: a.token, body: { timeZone: 'Asia/Tokyo' } })
    expect((await api(URL, { token: b.token })).body.timeZone).toBe('UTC')
    // Acting in another workshop through the header is refused like any other unknown workshop.
    const other = await api(URL, { method: 'PATCH', token: a.token, headers: { 'x-workshop-id': b.workshopId }, body: { timeZone: 'Asia/Tokyo' } })
    expect([403, 404]).toContain(other.status)
    expect((await api(URL, { token: b.token })).body.timeZone).toBe('UTC')
  })

  it('lets two parallel changes both land without a 500, the later one winning field by field', async () => {
    const owner = await newWorkshop()
    const replies = await Promise.all([
      api(URL, { method: 'PATCH', token: owner.token, body: { timeZone: 'Europe/Lisbon' } }),
      api(URL, { method: 'PATCH', token: owner.token, body: { referenceHz: 441 } }),
    ])
    expect(replies.map(r => r.status)).toEqual([200, 200])
    expect((await api(URL, { token: owner.token })).body).toMatchObject({ timeZone: 'Europe/Lisbon', referenceHz: 441 })
  })
})
