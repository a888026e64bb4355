import type { TemperatureUnit } from '../records/lists'
import { formatNumber } from './numbers'

/** Degrees Celsius in degrees Fahrenheit: t(°F) = t(°C) × 9/5 + 32 (the definition of the Fahrenheit scale). */
export function celsiusToFahrenheit(celsius: number): number {
  return celsius * 9 / 5 + 32
}

/** Degrees Fahrenheit in degrees Celsius: t(°C) = (t(°F) − 32) × 5/9 (the same definition, solved for °C). */
export function fahrenheitToCelsius(fahrenheit: number): number {
  return (fahrenheit - 32) * 5 / 9
}

/** A temperature stored in °C, written in the workshop's unit ("21.5 °C", "70.7 °F"). */
export function formatTemperature(celsius: number | null | undefined, unit: TemperatureUnit, digits = 1): string {
  if (celsius === null || celsius === undefined) return '—'
  return unit === 'F' ? formatNumber(celsiusToFahrenheit(celsius), '°F', digits) : formatNumber(celsius, '°C', digits)
}
