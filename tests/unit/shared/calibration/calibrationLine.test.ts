import { describe, expect, it } from 'vitest'
import { calibrationLine, formatOffsetPpm, formatUncertaintyPpm } from '../../../../shared/calibration/calibrationLine'

const day = (iso: string) => iso.slice(0, 10)
const measured = { offsetPpm: 41.26, uncertaintyPpm: 0.41, measuredAt: '2026-11-12T09:00:00.000Z' }

describe('calibrationLine', () => {
  it('states a valid calibration with its date and signed offset ± u in ppm', () => {
    expect(calibrationLine({ ...measured, expired: false, daysLeft: 69 }, day)).toEqual({ meaning: 'valid', text: 'Input calibrated 2026-11-12, +41.3 ± 0.4 ppm' })
  })

  it('warns when there is none or it has expired, saying how long ago', () => {
    expect(calibrationLine(null, day).meaning).toBe('warning')
    expect(calibrationLine(null, day).text).toMatch(/^No calibration for this input/)
    expect(calibrationLine({ ...measured, expired: true, daysLeft: -3 }, day)).toEqual({ meaning: 'warning', text: 'Calibration expired 3 days ago — record a reference tone.' })
    expect(calibrationLine({ ...measured, expired: true, daysLeft: 0 }, day).text).toBe('Calibration expired today — record a reference tone.')
  })

  it('writes offsets with a true minus and small uncertainties with two decimals', () => {
    expect(formatOffsetPpm(-12)).toBe('−12.0')
    expect(formatOffsetPpm(0)).toBe('+0.0')
    expect(formatUncertaintyPpm(0.02)).toBe('0.02')
    expect(formatUncertaintyPpm(1.26)).toBe('1.3')
  })
})
