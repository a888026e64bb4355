import type { CalibrationView } from '../schemas/calibrations'

/** An offset in ppm with its sign (a true minus) and one decimal: "+41.3", "−12.0". */
export function formatOffsetPpm(ppm: number): string {
  return `${ppm < 0 ? '−' : '+'}${Math.abs(ppm).toFixed(1)}`
}

/** A standard uncertainty in ppm: one decimal, two below 0.1 ppm so a small one never reads 0.0. */
export function formatUncertaintyPpm(ppm: number): string {
  return ppm < 0.1 ? ppm.toFixed(2) : ppm.toFixed(1)
}

export interface CalibrationLine {
  /** The look: a valid calibration, or the warning look for a missing or expired one. */
  meaning: 'valid' | 'warning'
  text: string
}

/**
 * The Bench's line about the input's calibration: "Input calibrated 12 Nov 2026, +41.3 ± 0.4 ppm",
 * or a warning when there is none or it has expired. `day` writes the measuring date in the
 * workshop's calendar.
 */
export function calibrationLine(
  calibration: Pick<CalibrationView, 'offsetPpm' | 'uncertaintyPpm' | 'measuredAt' | 'expired' | 'daysLeft'> | null,
  day: (iso: string) => string,
): CalibrationLine {
  if (!calibration) return { meaning: 'warning', text: 'No calibration for this input — strikes are not corrected for its clock. Record a reference tone.' }
  if (calibration.expired) {
    const ago = calibration.daysLeft === 0 ? 'today' : `${-calibration.daysLeft} ${calibration.daysLeft === -1 ? 'day' : 'days'} ago`
    return { meaning: 'warning', text: `Calibration expired ${ago} — record a reference tone.` }
  }
  return { meaning: 'valid', text: `Input calibrated ${day(calibration.measuredAt)}, ${formatOffsetPpm(calibration.offsetPpm)} ± ${formatUncertaintyPpm(calibration.uncertaintyPpm)} ppm` }
}
