import { z } from 'zod'

// Same ranges as the server's strike fields; empty means "not measured".
const optionalNumber = (what: string, min: number, max: number, unit: string) => z.string().trim()
  .refine(v => v === '' || Number.isFinite(Number(v.replace(',', '.'))), `${what} must be a number in ${unit}`)
  .refine(v => v === '' || (Number(v.replace(',', '.')) >= min && Number(v.replace(',', '.')) <= max), `${what} must be between ${min < 0 ? '−' + Math.abs(min) : min} and ${max} ${unit}`)

/** The bench conditions as typed into the Bench (strings, as inputs hold them). */
export const BenchConditionsSchema = z.object({
  temperatureC: optionalNumber('The bench temperature', -10, 50, '°C'),
  humidityPct: optionalNumber('The humidity', 0, 100, '%'),
})

/** A typed field as a number, or null when left empty. */
export function conditionValue(text: string | undefined): number | null {
  const t = (text ?? '').trim().replace(',', '.')
  return t === '' ? null : Number(t)
}
