import type { CalibrationExpiry } from './calibrationExpiry'

const days = (n: number) => `${n} ${n === 1 ? 'day' : 'days'}`

/** A calibration's expiry in a few plain words, as the Bench and the Calibrations screen write it. */
export function calibrationStatusWords(expiry: Pick<CalibrationExpiry, 'expired' | 'daysLeft'>): string {
  if (expiry.expired) return expiry.daysLeft === 0 ? 'expired today' : `expired ${days(-expiry.daysLeft)} ago`
  return expiry.daysLeft === 0 ? 'expires today' : `valid, expires in ${days(expiry.daysLeft)}`
}
