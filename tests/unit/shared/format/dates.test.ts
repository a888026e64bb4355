import { describe, expect, it } from 'vitest'
import { formatDate, formatDateTime, formatZonedDate, formatZonedDateTime, isLocale, isTimeZone, UTC_CLOCK } from '../../../../shared/format/dates'

const berlin = { timeZone: 'Europe/Berlin', locale: 'en-GB' }

describe('times in the workshop\'s zone', () => {
  it('moves to summer time in Europe/Berlin at 01:00 UTC on the last Sunday of March', () => {
    // source: IANA tz database (Europe/Berlin), EU summer-time rule: +01:00 CET until 2026-03-29T01:00Z, then +02:00 CEST.
    expect(formatZonedDateTime('2026-03-29T00:30:00Z', berlin)).toBe('29 Mar 2026, 01:30 CET')
    expect(formatZonedDateTime('2026-03-29T01:30:00Z', berlin)).toBe('29 Mar 2026, 03:30 CEST')
  })

  it('goes back to winter time at 01:00 UTC on the last Sunday of October, so 02:30 happens twice', () => {
    // source: IANA tz database (Europe/Berlin), EU summer-time rule: CEST ends 2026-10-25T01:00Z.
    expect(formatZonedDateTime('2026-10-25T00:30:00Z', berlin)).toBe('25 Oct 2026, 02:30 CEST')
    expect(formatZonedDateTime('2026-10-25T01:30:00Z', berlin)).toBe('25 Oct 2026, 02:30 CET')
  })

  it('follows the US rule in America/New_York and writes dates the way the locale does', () => {
    // source: IANA tz database (America/New_York): EDT from the second Sunday of March, 02:00 local = 07:00 UTC.
    expect(formatZonedDateTime('2026-03-08T06:30:00Z', { timeZone: 'America/New_York', locale: 'en-US' })).toBe('Mar 8, 2026, 01:30 EST')
    expect(formatZonedDateTime('2026-03-08T07:30:00Z', { timeZone: 'America/New_York', locale: 'en-US' })).toBe('Mar 8, 2026, 03:30 EDT')
  })

  it('gives the calendar day of the zone, not of UTC', () => {
    // source: IANA tz database (Asia/Tokyo): +09:00 all year, no summer time.
    expect(formatZonedDate('2026-03-29T23:30:00Z', { timeZone: 'Asia/Tokyo', locale: 'en-GB' })).toBe('30 Mar 2026')
    expect(formatZonedDate('2026-03-29T23:30:00Z', UTC_CLOCK)).toBe('29 Mar 2026')
    // The same day in a German workshop: day, month name and year in German order.
    expect(formatZonedDate('2026-03-29T12:00:00Z', { timeZone: 'Europe/Berlin', locale: 'de-DE' })).toBe('29. März 2026')
  })

  it('writes a dash for a missing or unreadable instant', () => {
    expect(formatZonedDateTime(null, berlin)).toBe('—')
    expect(formatZonedDateTime('not a date', berlin)).toBe('—')
    expect(formatZonedDate(undefined, berlin)).toBe('—')
  })

  it('keeps the zone-free UTC forms for documents read anywhere (certificates)', () => {
    expect(formatDateTime('2026-03-29T01:30:00Z')).toBe('2026-03-29 01:30 UTC')
    expect(formatDate('2026-03-29T01:30:00Z')).toBe('2026-03-29')
  })
})

describe('zone and locale names', () => {
  it('accepts IANA zone names and refuses others', () => {
    for (const zone of ['Europe/Berlin', 'America/New_York', 'Asia/Kolkata', 'UTC']) expect(isTimeZone(zone), zone).toBe(true)
    for (const zone of ['Mars/Olympus_Mons', '', 'Europe/', '+25:00', 'x'.repeat(80)]) expect(isTimeZone(zone), zone).toBe(false)
  })

  it('accepts BCP 47 language tags and refuses others', () => {
    for (const tag of ['en-GB', 'de-DE', 'fr', 'ja-JP']) expect(isLocale(tag), tag).toBe(true)
    for (const tag of ['', 'english please', 'en_GB!', 'x'.repeat(40)]) expect(isLocale(tag), tag).toBe(false)
  })
})
