import { describe, expect, it } from 'vitest'
import { calibrationDrift } from '../../../../shared/calibration/calibrationDrift'

describe('calibrationDrift', () => {
  it('gives the change and the straight-line rate between the oldest and newest calibration', () => {
    const drift = calibrationDrift([
      { offsetPpm: 42.0, measuredAt: '2026-07-02T00:00:00Z' },
      { offsetPpm: 40.0, measuredAt: '2026-01-01T00:00:00Z' },
      { offsetPpm: 41.1, measuredAt: '2026-04-01T00:00:00Z' },
    ])!
    // 1 Jan to 2 Jul 2026 is 182 days (calendar arithmetic); 2 ppm over 182 days is 2 × 365.25 / 182 ≈ 4.014 ppm a year.
    expect(drift).toMatchObject({ firstPpm: 40, lastPpm: 42, days: 182 })
    expect(drift.changePpm).toBeCloseTo(2, 12)
    expect(drift.ppmPerYear!).toBeCloseTo(4.0137, 3)
  })

  it('has no rate for a single calibration and nothing for none', () => {
    expect(calibrationDrift([{ offsetPpm: 5, measuredAt: '2026-01-01T00:00:00Z' }])).toMatchObject({ changePpm: 0, ppmPerYear: null })
    expect(calibrationDrift([])).toBeNull()
  })
})
