/**
 * The instant a calendar week began in a time zone: Monday 00:00 local time (ISO 8601
 * weeks start on Monday), as a UTC Date. The local wall clock is read with Intl, so
 * daylight-saving changes inside the week are handled by the time zone database.
 */
export function weekStartIn(now: Date, timeZone: string): Date {
  const parts = localParts(now.getTime(), timeZone)
  // Days since Monday of the local calendar day (Date.UTC only does calendar arithmetic here).
  const localDay = new Date(Date.UTC(parts.year, parts.month - 1, parts.day))
  const sinceMonday = (localDay.getUTCDay() + 6) % 7
  const monday = Date.UTC(parts.year, parts.month - 1, parts.day - sinceMonday)
  return new Date(localMidnightMs(monday, timeZone))
}

interface LocalParts { year: number, month: number, day: number, hour: number, minute: number, second: number }

const formatters = new Map<string, Intl.DateTimeFormat>()

function localParts(ms: number, timeZone: string): LocalParts {
  let f = formatters.get(timeZone)
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', minute: 'numeric', second: 'numeric' })
    formatters.set(timeZone, f)
  }
  const n = Object.fromEntries(f.formatToParts(ms).filter(p => p.type !== 'literal').map(p => [p.type, Number(p.value)]))
  return { year: n.year!, month: n.month!, day: n.day!, hour: n.hour!, minute: n.minute!, second: n.second! }
}

/** The zone's offset from UTC at an instant, in ms (local wall clock read as UTC, minus the instant). */
function offsetMs(ms: number, timeZone: string): number {
  const p = localParts(ms, timeZone)
  return Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute, p.second) - Math.floor(ms / 1000) * 1000
}

/**
 * The first instant of a local calendar day (given as that day's 00:00 read as UTC). Where
 * a zone skips midnight (a daylight-saving change at 00:00), the day starts at the first
 * wall-clock time it has.
 */
function localMidnightMs(dayAsUtcMs: number, timeZone: string): number {
  let guess = dayAsUtcMs - offsetMs(dayAsUtcMs, timeZone)
  // Once more with the offset at the guess: right across a change of offset.
  guess = dayAsUtcMs - offsetMs(guess, timeZone)
  const p = localParts(guess, timeZone)
  // Still on the day before: midnight does not exist that day; move to the change.
  if (Date.UTC(p.year, p.month - 1, p.day) < dayAsUtcMs) guess += 24 * 3600_000 - ((p.hour * 60 + p.minute) * 60 + p.second) * 1000
  return guess
}
