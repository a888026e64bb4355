import type { DecisionVerdict } from './types'

/** A piece's verdict from its required partials' verdicts: any fail fails, any conditional is conditional; a missing one gives none. */
export function pieceVerdict(verdicts: readonly (DecisionVerdict | null)[]): DecisionVerdict | null {
  if (verdicts.length === 0 || verdicts.some(v => v === null)) return null
  if (verdicts.includes('fail')) return 'fail'
  if (verdicts.includes('conditional')) return 'conditional'
  return 'pass'
}
