import type { PartialMatch, Verdict } from './types'

/**
 * Verdict over the required partials: `outside` when one is outside its tolerance
 * (the piece needs work whatever else is missing), else `incomplete` when one is
 * missing, else `within`. Optional partials never change the verdict.
 */
export function decideVerdict(matches: readonly PartialMatch[]): Verdict {
  const required = matches.filter(m => m.required)
  if (required.some(m => !m.missing && !m.within)) return 'outside'
  if (required.some(m => m.missing)) return 'incomplete'
  return 'within'
}
