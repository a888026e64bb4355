/** A date and time as "2026-03-14 09:30 UTC": unambiguous for workshops and buyers in any country. */
export function formatDateTime(value: string | Date | null | undefined): string {
  if (!value) return '—'
  const d = typeof value === 'string' ? new Date(value) : value
  if (Number.isNaN(d.getTime())) return '—'
  return `${d.toISOString().slice(0, 10)} ${d.toISOString().slice(11, 16)} UTC`
}

export function formatDate(value: string | Date | null | undefined): string {
  if (!value) return '—'
  const d = typeof value === 'string' ? new Date(value) : value
  return Number.isNaN(d.getTime()) ? '—' : d.toISOString().slice(0, 10)
}

/** Where and how a workshop reads its times: an IANA time zone and a BCP 47 language tag. */
export interface WorkshopClock { timeZone: string, locale: string }

/** The clock before a workshop has chosen one (and for anyone outside a workshop). */
export const UTC_CLOCK: WorkshopClock = { timeZone: 'UTC', locale: 'en-GB' }

const formatters = new Map<string, Intl.DateTimeFormat>()

function formatterFor(clock: WorkshopClock, withTime: boolean): Intl.DateTimeFormat {
  const key = `${clock.locale}|${clock.timeZone}|${withTime}`
  let f = formatters.get(key)
  if (!f) {
    const time: Intl.DateTimeFormatOptions = withTime ? { hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZoneName: 'short' } : {}
    f = new Intl.DateTimeFormat(clock.locale, { day: 'numeric', month: 'short', year: 'numeric', timeZone: clock.timeZone, ...time })
    formatters.set(key, f)
  }
  return f
}

function instant(value: string | Date | null | undefined): Date | null {
  if (!value) return null
  const d = typeof value === 'string' ? new Date(value) : value
  return Number.isNaN(d.getTime()) ? null : d
}

/** An instant as the workshop reads it: "29 Mar 2026, 03:30 CEST" (its zone, its locale, the zone's short name). */
export function formatZonedDateTime(value: string | Date | null | undefined, clock: WorkshopClock): string {
  const d = instant(value)
  return d ? formatterFor(clock, true).format(d) : '—'
}

/** The workshop's calendar day of an instant, in its locale: "30 Mar 2026". */
export function formatZonedDate(value: string | Date | null | undefined, clock: WorkshopClock): string {
  const d = instant(value)
  return d ? formatterFor(clock, false).format(d) : '—'
}

/** True for a time zone name the IANA database (as this runtime's Intl knows it) has. */
export function isTimeZone(name: string): boolean {
  if (!name || name.length > 64) return false
  try {
    new Intl.DateTimeFormat('en', { timeZone: name })
    return true
  }
  catch {
    return false
  }
}

/** True for a well-formed BCP 47 language tag that Intl can format dates in. */
export function isLocale(tag: string): boolean {
  if (!tag || tag.length > 35) return false
  try {
    return Intl.DateTimeFormat.supportedLocalesOf([tag]).length > 0
  }
  catch {
    return false
  }
}
