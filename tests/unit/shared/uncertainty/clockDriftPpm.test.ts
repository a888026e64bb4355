import { describe, expect, it } from 'vitest'
import { clockDriftPpm } from '../../../../shared/uncertainty/clockDriftPpm'

const DAY = 86_400_000

describe('clockDriftPpm', () => {
  it('extrapolates the least-squares slope of the offsets over the days since the calibration', () => {
    // Worked by hand (least squares, common practice): offsets 0, 10, 20 ppm at days 0, 10, 20 → slope 1 ppm/day; 15 days → 15 ppm.
    const history = [{ atMs: 0, offsetPpm: 0 }, { atMs: 10 * DAY, offsetPpm: 10 }, { atMs: 20 * DAY, offsetPpm: 20 }]
    expect(clockDriftPpm(history, 20 * DAY, 35 * DAY)).toBeCloseTo(15, 9)
  })

  it('gives the size of a falling drift', () => {
    // Slope of (0, 4) and (8, 0) days → −0.5 ppm/day; 6 days → 3 ppm (from memory: the slope of two points).
    expect(clockDriftPpm([{ atMs: 0, offsetPpm: 4 }, { atMs: 8 * DAY, offsetPpm: 0 }], 8 * DAY, 14 * DAY)).toBeCloseTo(3, 9)
  })

  it('cannot assess drift from one calibration or from calibrations at one instant', () => {
    expect(clockDriftPpm([{ atMs: 0, offsetPpm: 5 }], 0, DAY)).toBeNull()
    expect(clockDriftPpm([{ atMs: DAY, offsetPpm: 5 }, { atMs: DAY, offsetPpm: 6 }], DAY, 2 * DAY)).toBeNull()
  })

  it('refuses readings that are not numbers', () => {
    expect(() => clockDriftPpm([{ atMs: Number.NaN, offsetPpm: 1 }, { atMs: 0, offsetPpm: 1 }], 0, 0)).toThrow(RangeError)
  })
})
