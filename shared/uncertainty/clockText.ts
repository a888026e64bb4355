import type { ClockEvidence } from './evidence'

const ppm = (v: number, digits: number) => `${v < 0 ? '−' : v > 0 ? '+' : ''}${Math.abs(v).toFixed(digits)}`

/** The input calibration a strike was measured under, in one plain line; a missing or expired one said so. */
export function clockText(clock: ClockEvidence): string {
  if (clock.state === 'none') return 'No input calibration: the sound input\'s clock was not calibrated for this strike, so its error is not assessed.'
  const when = clock.calibratedAt.slice(0, 10)
  const drift = clock.driftPpm === null
    ? 'drift not assessed (one calibration of this input so far)'
    : `drift since then up to ${clock.driftPpm.toFixed(2)} ppm from its history`
  return `${clock.device}, calibrated ${when}: offset ${ppm(clock.offsetPpm, 2)} ppm ± ${clock.uncertaintyPpm.toFixed(2)} ppm (k = 1); ${drift}${clock.expired ? '; EXPIRED at the time of the strike' : ''}.`
}
