import { FINAL_STATE_AGREEMENT_CENTS } from './evidence'

/**
 * How many of a piece's strikes, newest first, read the same bar as the first of them: the run
 * ends at the first strike whose fundamental lies more than `agreementCents` from the newest one's
 * (a cut in between), or that has no fundamental. The newest strike always counts.
 */
export function unchangedRun(fundamentalsHz: readonly (number | null)[], agreementCents = FINAL_STATE_AGREEMENT_CENTS): number {
  if (fundamentalsHz.length === 0) return 0
  const reference = fundamentalsHz[0]
  if (!(typeof reference === 'number' && reference > 0)) return 1
  let n = 1
  for (const f of fundamentalsHz.slice(1)) {
    if (!(typeof f === 'number' && f > 0) || Math.abs(1200 * Math.log2(f / reference)) > agreementCents) break
    n++
  }
  return n
}
