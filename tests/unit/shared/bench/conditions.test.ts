import { describe, expect, it } from 'vitest'
import { benchConditionsSchema, temperatureFromInput, temperatureToInput } from '../../../../shared/bench/conditions'

const message = (unit: 'C' | 'F', temperature: string) => {
  const parsed = benchConditionsSchema(unit).safeParse({ temperature, humidityPct: '' })
  return parsed.success ? null : parsed.error.issues[0]!.message
}

describe('bench conditions in the workshop\'s unit', () => {
  it('reads a temperature typed in °F as the °C it is stored in', () => {
    // source: definition of the Fahrenheit scale: water freezes at 32 °F (0 °C) and boils at 212 °F (100 °C) at 1 atm.
    expect(temperatureFromInput('32', 'F')).toBe(0)
    expect(temperatureFromInput('212', 'F')).toBe(100)
    // source: common practice: 68 °F is the 20 °C room temperature; the Celsius field takes what it is given, a decimal comma too.
    expect(temperatureFromInput('68', 'F')).toBeCloseTo(20, 12)
    expect(temperatureFromInput('21,5', 'C')).toBe(21.5)
    expect(temperatureFromInput(' ', 'F')).toBeNull()
  })

  it('shows a stored °C temperature in the workshop\'s unit, to 0.1 °F', () => {
    // source: t(°F) = t(°C) × 9/5 + 32: 20 °C = 68 °F, 21.3 °C = 70.34 °F.
    expect(temperatureToInput(20, 'F')).toBe('68')
    expect(temperatureToInput(21.3, 'F')).toBe('70.3')
    expect(temperatureToInput(21.3, 'C')).toBe('21.3')
    expect(temperatureToInput(null, 'F')).toBe('')
    // A value typed in °F comes back as typed.
    expect(temperatureToInput(temperatureFromInput('70', 'F'), 'F')).toBe('70')
  })

  it('accepts the same bench range in either unit and says the limits in the unit typed', () => {
    // source: t(°F) = t(°C) × 9/5 + 32: the strike fields' −10…50 °C is 14…122 °F.
    expect(message('F', '14')).toBeNull()
    expect(message('F', '122')).toBeNull()
    expect(message('F', '123')).toBe('The bench temperature must be between 14 and 122 °F')
    expect(message('C', '51')).toBe('The bench temperature must be between −10 and 50 °C')
    expect(message('F', 'warm')).toBe('The bench temperature must be a number in °F')
  })
})
