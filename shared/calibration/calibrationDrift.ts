import type { CalibrationView } from '../schemas/calibrations'

const DAY_MS = 86_400_000

export interface CalibrationDrift {
  firstPpm: number
  lastPpm: number
  /** Last minus first offset, ppm. */
  changePpm: number
  days: number
  /** Straight-line rate between the first and the last calibration, ppm per year of 365.25 days; null for one calibration or one day. */
  ppmPerYear: number | null
}

/** How a device's offset moved between its oldest and newest calibration (any order in). */
export function calibrationDrift(history: readonly Pick<CalibrationView, 'offsetPpm' | 'measuredAt'>[]): CalibrationDrift | null {
  if (history.length === 0) return null
  const sorted = [...history].sort((a, b) => Date.parse(a.measuredAt) - Date.parse(b.measuredAt))
  const first = sorted[0]!
  const last = sorted[sorted.length - 1]!
  const days = (Date.parse(last.measuredAt) - Date.parse(first.measuredAt)) / DAY_MS
  const changePpm = last.offsetPpm - first.offsetPpm
  return { firstPpm: first.offsetPpm, lastPpm: last.offsetPpm, changePpm, days: Math.round(days), ppmPerYear: days >= 1 ? changePpm / (days / 365.25) : null }
}
