import { partialUncertaintyCents } from '../../shared/analysis/partialUncertaintyCents'

/**
 * A partial's uncertainty without its line's allowance (partialUncertaintyCents): the Cramér–Rao
 * bound, the spread of the two readings and the decay's pull (decayPull), cents — what the estimators' own tests are about.
 */
export function statisticalCents(p: { uncertaintyCents: number | null, frequencyHz: number, decayDbPerS: number }): number {
  const line = partialUncertaintyCents(0, 0, p.frequencyHz, p.decayDbPerS)
  return Math.sqrt(Math.max(0, p.uncertaintyCents! ** 2 - line ** 2))
}
