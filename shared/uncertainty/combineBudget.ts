import { COVERAGE_FACTOR, type BudgetLine, type UncertaintyBudget } from './types'

/**
 * Combined standard uncertainty of uncorrelated inputs u = √Σ(cᵢuᵢ)² (JCGM 100:2008 §5.1.2)
 * and the expanded uncertainty U = k·u (§6.2.1), k = 2 unless told.
 */
export function combineBudget(lines: BudgetLine[], unit: string, coverageFactor = COVERAGE_FACTOR): UncertaintyBudget {
  if (!(coverageFactor > 0 && Number.isFinite(coverageFactor))) throw new RangeError('combineBudget needs a positive coverage factor')
  let sum = 0
  for (const line of lines) sum += line.contribution * line.contribution
  const combined = Math.sqrt(sum)
  return { lines, unit, combinedStandardUncertainty: combined, coverageFactor, expandedUncertainty: coverageFactor * combined }
}
