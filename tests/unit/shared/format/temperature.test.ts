import { describe, expect, it } from 'vitest'
import { celsiusToFahrenheit, formatTemperature } from '../../../../shared/format/temperature'

describe('temperatures in the workshop\'s unit', () => {
  it('converts on the fixed points of water and where the scales meet', () => {
    // source: NIST SP 811 (2008), B.8: t/°F = 1.8 t/°C + 32; water freezes at 0 °C = 32 °F, boils at 100 °C = 212 °F at 1 atm.
    expect(celsiusToFahrenheit(0)).toBe(32)
    expect(celsiusToFahrenheit(100)).toBe(212)
    expect(celsiusToFahrenheit(-40)).toBe(-40)
  })

  it('writes the stored °C in the chosen unit with its symbol', () => {
    expect(formatTemperature(21.5, 'C')).toBe('21.5 °C')
    // 21.5 × 1.8 + 32 = 70.7
    expect(formatTemperature(21.5, 'F')).toBe('70.7 °F')
    expect(formatTemperature(-5, 'F', 0)).toBe('23 °F')
    expect(formatTemperature(null, 'F')).toBe('—')
  })
})
