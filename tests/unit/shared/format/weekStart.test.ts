import { describe, expect, it } from 'vitest'
import { weekStartIn } from '../../../../shared/format/weekStart'

const at = (iso: string) => new Date(iso)

describe('weekStartIn', () => {
  it('starts the week on Monday 00:00 (ISO 8601) in UTC', () => {
    // source: ISO 8601 (weeks begin on Monday); 2026-12-03 is a Thursday (proleptic Gregorian calendar).
    expect(weekStartIn(at('2026-12-03T07:49:00Z'), 'UTC').toISOString()).toBe('2026-11-30T00:00:00.000Z')
    expect(weekStartIn(at('2026-11-30T00:00:00Z'), 'UTC').toISOString()).toBe('2026-11-30T00:00:00.000Z')
  })

  it('ahead of UTC: Monday morning in Auckland is still Sunday in UTC, and the week has begun there', () => {
    // source: IANA tz database (Pacific/Auckland): NZDT, UTC+13, from the last Sunday of September 2026.
    expect(weekStartIn(at('2026-11-29T12:00:00Z'), 'Pacific/Auckland').toISOString()).toBe('2026-11-29T11:00:00.000Z')
  })

  it('behind UTC: Sunday evening in Los Angeles is Monday in UTC, and the week there is still the old one', () => {
    // source: IANA tz database (America/Los_Angeles): PST, UTC−8, from the first Sunday of November 2026.
    expect(weekStartIn(at('2026-11-30T05:00:00Z'), 'America/Los_Angeles').toISOString()).toBe('2026-11-23T08:00:00.000Z')
  })

  it('takes Monday\'s own offset when summer time began later in the week', () => {
    // source: IANA tz database (Europe/Berlin), EU rule: CET (UTC+1) until 2026-03-29T01:00Z, then CEST (UTC+2).
    expect(weekStartIn(at('2026-03-29T12:00:00Z'), 'Europe/Berlin').toISOString()).toBe('2026-03-22T23:00:00.000Z')
    expect(weekStartIn(at('2026-03-30T10:00:00Z'), 'Europe/Berlin').toISOString()).toBe('2026-03-29T22:00:00.000Z')
  })

  it('starts at the first wall-clock time a Monday has when that Monday has no midnight', () => {
    // source: IANA tz database (Asia/Tehran): clocks went from 00:00 to 01:00 (+03:30 → +04:30) on Monday 2021-03-22.
    expect(weekStartIn(at('2021-03-24T12:00:00Z'), 'Asia/Tehran').toISOString()).toBe('2021-03-21T20:30:00.000Z')
  })
})
