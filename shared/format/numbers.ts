import type { PartialState } from '../records/lists'

/** Signed cents with one decimal and the unit, using a true minus sign: "+3.2 ¢", "−0.4 ¢". */
export function formatCents(cents: number | null | undefined, digits = 1): string {
  if (cents === null || cents === undefined || !Number.isFinite(cents)) return '—'
  const rounded = Number(cents.toFixed(digits))
  const sign = rounded > 0 ? '+' : rounded < 0 ? '−' : '±'
  return `${sign}${Math.abs(rounded).toFixed(digits)} ¢`
}

export function formatHz(hz: number | null | undefined, digits = 2): string {
  if (hz === null || hz === undefined || !Number.isFinite(hz)) return '—'
  return `${hz.toFixed(digits)} Hz`
}

export function formatNumber(value: number | null | undefined, unit: string, digits = 1): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—'
  const text = value < 0 ? `−${Math.abs(value).toFixed(digits)}` : value.toFixed(digits)
  return `${text} ${unit}`
}

/** The state a matched partial is shown in: within its band, sharp or flat outside it, or missing. */
export function partialState(match: { within: boolean, missing: boolean, cents: number | null }): PartialState {
  if (match.missing || match.cents === null) return 'missing'
  if (match.within) return 'within'
  return match.cents > 0 ? 'sharp' : 'flat'
}
