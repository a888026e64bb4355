import { z } from 'zod'
import { celsiusToFahrenheit, fahrenheitToCelsius } from '../format/temperature'
import type { TemperatureUnit } from '../records/lists'

/** The bench temperatures a strike may carry, in °C (the server's strike fields). */
export const BENCH_TEMPERATURE_RANGE_C = { min: -10, max: 50 } as const

const number = (v: string) => Number(v.replace(',', '.'))
const signed = (v: number) => (v < 0 ? `−${Math.abs(v)}` : String(v))

// Same ranges as the server's strike fields; empty means "not measured".
const optionalNumber = (what: string, min: number, max: number, unit: string) => z.string().trim()
  .refine(v => v === '' || Number.isFinite(number(v)), `${what} must be a number in ${unit}`)
  .refine(v => v === '' || (number(v) >= min && number(v) <= max), `${what} must be between ${signed(min)} and ${max} ${unit}`)

/**
 * The bench conditions as typed into the Bench (strings, as inputs hold them): the
 * temperature in the workshop's unit (°C unless told), the humidity in %.
 */
export function benchConditionsSchema(unit: TemperatureUnit = 'C') {
  const { min, max } = BENCH_TEMPERATURE_RANGE_C
  const range = unit === 'F' ? [celsiusToFahrenheit(min), celsiusToFahrenheit(max)] as const : [min, max] as const
  return z.object({
    temperature: optionalNumber('The bench temperature', range[0], range[1], `°${unit}`),
    humidityPct: optionalNumber('The humidity', 0, 100, '%'),
  })
}

/** A typed field as a number, or null when left empty. */
export function conditionValue(text: string | undefined): number | null {
  const t = (text ?? '').trim().replace(',', '.')
  return t === '' ? null : Number(t)
}

/** A typed temperature in the workshop's unit as the °C it is stored in, or null when left empty. */
export function temperatureFromInput(text: string | undefined, unit: TemperatureUnit): number | null {
  const value = conditionValue(text)
  return value === null || unit === 'C' ? value : fahrenheitToCelsius(value)
}

/** A stored °C temperature as the field shows it in the workshop's unit (to 0.1 °F, so 20 °C reads "68"). */
export function temperatureToInput(celsius: number | null, unit: TemperatureUnit): string {
  if (celsius === null) return ''
  return unit === 'C' ? String(celsius) : String(Math.round(celsiusToFahrenheit(celsius) * 10) / 10)
}
