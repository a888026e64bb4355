// Scoring of partials found against a reference: found/missed and agreement in cents.
import { centsBetween, type MeasuredPartial } from '../../shared/analysis/index'

export interface Score {
  found: boolean[]
  /** |cents| between each found reference partial and the nearest reported one; NaN when missed. */
  cents: number[]
}

/** A reference partial is found when a reported partial lies within `toleranceCents` of it. */
export function scorePartials(partials: readonly MeasuredPartial[], referenceHz: readonly number[], toleranceCents = 15): Score {
  const found: boolean[] = []
  const cents: number[] = []
  for (const f of referenceHz) {
    let best = Infinity
    for (const p of partials) best = Math.min(best, Math.abs(centsBetween(p.frequencyHz, f)))
    found.push(best <= toleranceCents)
    cents.push(best <= toleranceCents ? best : Number.NaN)
  }
  return { found, cents }
}

export function quantile(values: readonly number[], q: number): number {
  const s = values.filter(v => Number.isFinite(v)).sort((a, b) => a - b)
  if (s.length === 0) return Number.NaN
  return s[Math.min(s.length - 1, Math.floor(q * s.length))]!
}
