const DAY_MS = 86_400_000

export interface CalibrationExpiry {
  /** When the calibration stops being valid: measured + the workshop's interval. */
  expiresAt: Date
  expired: boolean
  /** Whole days until it expires (rounded up; 0 = expires within the day); negative: whole days since it expired. */
  daysLeft: number
}

/**
 * Whether a calibration measured at `measuredAt` is still valid `now` under a workshop's
 * interval of `validDays` days (common practice: a calibration has a stated due date after
 * which results are not traceable to it until it is repeated).
 */
export function calibrationExpiry(measuredAt: Date, validDays: number, now: Date): CalibrationExpiry {
  if (!(Number.isInteger(validDays) && validDays > 0)) throw new RangeError('calibrationExpiry needs a whole number of days above 0')
  if (Number.isNaN(measuredAt.getTime()) || Number.isNaN(now.getTime())) throw new RangeError('calibrationExpiry needs valid dates')
  const expiresAt = new Date(measuredAt.getTime() + validDays * DAY_MS)
  const leftMs = expiresAt.getTime() - now.getTime()
  const expired = leftMs <= 0
  return { expiresAt, expired, daysLeft: expired ? -Math.floor(-leftMs / DAY_MS) : Math.floor(leftMs / DAY_MS) }
}
