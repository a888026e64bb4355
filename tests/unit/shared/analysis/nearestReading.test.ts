import { describe, expect, it } from 'vitest'
import { nearestReading } from '../../../../shared/analysis/nearestReading'

describe('nearestReading', () => {
  const readings = [{ frequencyHz: 100 }, { frequencyHz: 104 }, { frequencyHz: 110 }, { frequencyHz: 96 }]

  it('finds the nearest reading closer than the reach', () => {
    expect(nearestReading(readings, 103, 5)).toBe(1)
    expect(nearestReading(readings, 97, 5)).toBe(3)
  })

  it('takes the first of two equally near readings', () => {
    expect(nearestReading(readings, 102, 5)).toBe(0)
  })

  it('finds none when nothing is closer than the reach (the reach itself is not close enough)', () => {
    expect(nearestReading(readings, 120, 5)).toBe(-1)
    expect(nearestReading(readings, 115, 5)).toBe(-1)
    expect(nearestReading([], 100, 5)).toBe(-1)
  })
})
