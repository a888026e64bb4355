import { describe, expect, it } from 'vitest'
import { CONDITIONS_STALE_AFTER_MS, conditionsAge } from '../../../../shared/bench/conditionsAge'

const at = (iso: string) => Date.parse(iso)
const MIN = 60_000

describe('bench conditions age', () => {
  it('asks again after two hours by default', () => {
    expect(CONDITIONS_STALE_AFTER_MS).toBe(2 * 60 * MIN)
    const entered = at('2026-03-10T09:12:00Z')
    expect(conditionsAge(entered, entered + 119 * MIN, { timeZone: 'UTC' })).toEqual({ clock: '09:12', ago: '1 h ago', stale: false, reason: null })
    expect(conditionsAge(entered, entered + 120 * MIN, { timeZone: 'UTC' })).toEqual({ clock: '09:12', ago: '2 h ago', stale: true, reason: 'age' })
  })

  it('takes another limit when told', () => {
    const entered = at('2026-03-10T09:00:00Z')
    expect(conditionsAge(entered, entered + 31 * MIN, { timeZone: 'UTC', staleAfterMs: 30 * MIN }).stale).toBe(true)
    expect(conditionsAge(entered, entered + 29 * MIN, { timeZone: 'UTC', staleAfterMs: 30 * MIN })).toMatchObject({ stale: false, ago: '29 min ago' })
  })

  it('asks again on a new day in the workshop\'s time zone, even within two hours', () => {
    // source: IANA time zone database — Europe/Berlin is UTC+1 in winter (CET), America/New_York UTC−5 (EST)
    const entered = at('2026-01-15T22:30:00Z') // 23:30 in Berlin, 17:30 in New York
    const now = at('2026-01-15T23:10:00Z') // 00:10 the next day in Berlin, 18:10 in New York
    expect(conditionsAge(entered, now, { timeZone: 'Europe/Berlin' })).toEqual({ clock: '23:30', ago: '40 min ago', stale: true, reason: 'new-day' })
    expect(conditionsAge(entered, now, { timeZone: 'America/New_York' })).toEqual({ clock: '17:30', ago: '40 min ago', stale: false, reason: null })
  })

  it('uses the runtime\'s own time zone when none is given', () => {
    const entered = at('2026-06-01T12:00:00Z')
    const own = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(entered)
    expect(conditionsAge(entered, entered + 5 * MIN).clock).toBe(own)
  })

  it('conditions never entered, or entered in the future, are stale', () => {
    const now = at('2026-03-10T09:00:00Z')
    expect(conditionsAge(null, now)).toMatchObject({ stale: true, reason: 'unknown' })
    expect(conditionsAge(Number.NaN, now)).toMatchObject({ stale: true, reason: 'unknown' })
    expect(conditionsAge(now + 10 * MIN, now, { timeZone: 'UTC' })).toMatchObject({ stale: true, reason: 'unknown' })
    // A few seconds of clock difference between tabs is not an error.
    expect(conditionsAge(now + 5_000, now, { timeZone: 'UTC' })).toMatchObject({ stale: false, ago: 'just now' })
  })

  it('counts days once past two days', () => {
    const entered = at('2026-03-10T09:00:00Z')
    expect(conditionsAge(entered, entered + 50 * 60 * MIN, { timeZone: 'UTC' }).ago).toBe('2 days ago')
  })
})
