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

/**
 * Longest T60 worth a figure, s: a strike recorded for a few seconds falls less than
 * 0.6 dB/s · span there, which it cannot tell from a line that does not decay (hum).
 */
export const LONGEST_SHOWN_T60_S = 100

/** A T60 as a figure, "over 100 s" beyond LONGEST_SHOWN_T60_S, "—" when not decaying. */
export function formatT60(t60S: number | null | undefined, digits = 2): string {
  if (t60S === null || t60S === undefined || !(t60S > 0)) return '—'
  if (t60S > LONGEST_SHOWN_T60_S) return `over ${LONGEST_SHOWN_T60_S} s`
  return formatNumber(t60S, 's', digits)
}

/** The state a matched partial is shown in: within its band, sharp or flat outside it, or missing. */
export function partialState(match: { within: boolean, missing: boolean, cents: number | null }): PartialState {
  if (match.missing || match.cents === null) return 'missing'
  if (match.within) return 'within'
  return match.cents > 0 ? 'sharp' : 'flat'
}
