import { describe, expect, it } from 'vitest'
import { calibrationExpiry } from '../../../../shared/calibration/calibrationExpiry'
import { calibrationStatusWords } from '../../../../shared/calibration/calibrationStatusWords'

const measured = new Date('2026-08-01T10:00:00Z')
const at = (iso: string) => calibrationExpiry(measured, 90, new Date(iso))

describe('calibrationExpiry', () => {
  it('expires after the interval: 1 Aug + 90 days is 30 Oct (calendar arithmetic, common practice)', () => {
    expect(at('2026-08-02T10:00:00Z').expiresAt.toISOString()).toBe('2026-10-30T10:00:00.000Z')
    expect(at('2026-08-02T10:00:00Z')).toMatchObject({ expired: false, daysLeft: 89 })
    expect(at('2026-10-29T09:00:00Z')).toMatchObject({ expired: false, daysLeft: 1 })
    expect(at('2026-10-30T09:00:00Z')).toMatchObject({ expired: false, daysLeft: 0 })
    expect(at('2026-10-30T10:00:00Z')).toMatchObject({ expired: true, daysLeft: 0 })
    expect(at('2026-11-02T11:00:00Z')).toMatchObject({ expired: true, daysLeft: -3 })
  })

  it('refuses an interval that is not a whole number of days, and invalid dates', () => {
    expect(() => calibrationExpiry(measured, 0, measured)).toThrow(RangeError)
    expect(() => calibrationExpiry(measured, 1.5, measured)).toThrow(RangeError)
    expect(() => calibrationExpiry(new Date('nonsense'), 90, measured)).toThrow(RangeError)
  })
})

describe('calibrationStatusWords', () => {
  it('says how long is left or how long ago it expired', () => {
    expect(calibrationStatusWords({ expired: false, daysLeft: 12 })).toBe('valid, expires in 12 days')
    expect(calibrationStatusWords({ expired: false, daysLeft: 1 })).toBe('valid, expires in 1 day')
    expect(calibrationStatusWords({ expired: false, daysLeft: 0 })).toBe('expires today')
    expect(calibrationStatusWords({ expired: true, daysLeft: 0 })).toBe('expired today')
    expect(calibrationStatusWords({ expired: true, daysLeft: -3 })).toBe('expired 3 days ago')
  })
})
