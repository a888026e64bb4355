/** How long bench conditions are trusted before the Bench asks for them again. */
export const CONDITIONS_STALE_AFTER_MS = 2 * 60 * 60 * 1000

/** The one sentence that says why stale conditions matter. */
export const STALE_CONDITIONS_SENTENCE = 'A stale bench temperature changes the normalised cents on a certificate: check the temperature and humidity before the next strike.'

export interface ConditionsAge {
  /** When they were entered, as a wall clock in the time zone ("09:12"). */
  clock: string
  /** How long ago, in words ("2 h ago"). */
  ago: string
  /** True when they must be asked for again. */
  stale: boolean
  /** Why they are stale: too old, entered on another day, or an entry time that makes no sense. */
  reason: 'age' | 'new-day' | 'unknown' | null
}

/** The calendar day of an instant in a time zone (undefined: the runtime's own), as YYYY-MM-DD. */
function dayIn(ms: number, timeZone: string | undefined) {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(ms)
}

function agoWords(elapsedMs: number) {
  const minutes = Math.floor(elapsedMs / 60_000)
  if (minutes < 1) return 'just now'
  if (minutes < 60) return `${minutes} min ago`
  const hours = Math.floor(minutes / 60)
  if (hours < 48) return `${hours} h ago`
  return `${Math.floor(hours / 24)} days ago`
}

/**
 * How old the bench conditions are and whether to ask again: after `staleAfterMs`
 * (2 h unless told) or once the calendar day has changed in the workshop's time zone
 * (the runtime's own when none is given). An entry time in the future (a clock put
 * back) or none at all is stale too.
 */
export function conditionsAge(enteredAtMs: number | null, nowMs: number, options: { timeZone?: string, staleAfterMs?: number } = {}): ConditionsAge {
  const staleAfterMs = options.staleAfterMs ?? CONDITIONS_STALE_AFTER_MS
  if (enteredAtMs === null || !Number.isFinite(enteredAtMs) || !Number.isFinite(nowMs)) {
    return { clock: '—', ago: 'never', stale: true, reason: 'unknown' }
  }
  const clock = new Intl.DateTimeFormat('en-GB', { timeZone: options.timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(enteredAtMs)
  const elapsedMs = nowMs - enteredAtMs
  // A minute of clock skew between tabs is not a problem; more is.
  if (elapsedMs < -60_000) return { clock, ago: 'in the future', stale: true, reason: 'unknown' }
  const ago = agoWords(Math.max(0, elapsedMs))
  if (elapsedMs >= staleAfterMs) return { clock, ago, stale: true, reason: 'age' }
  if (dayIn(enteredAtMs, options.timeZone) !== dayIn(nowMs, options.timeZone)) return { clock, ago, stale: true, reason: 'new-day' }
  return { clock, ago, stale: false, reason: null }
}
