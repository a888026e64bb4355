import type { DecisionRule, DecisionVerdict } from './types'

/**
 * Conformity of a deviation Δ with a symmetric tolerance ±T (ILAC-G8:09/2019 §4.2):
 * simple acceptance passes when |Δ| ≤ T; guarded acceptance (guard band w = U) passes when
 * |Δ| + U ≤ T, fails when |Δ| − U > T, and is conditional when T lies inside |Δ| ± U.
 */
export function decideConformity(deviation: number, toleranceAbs: number, expandedUncertainty: number, rule: DecisionRule): DecisionVerdict {
  if (!Number.isFinite(deviation)) throw new RangeError('decideConformity needs a finite deviation')
  if (!(toleranceAbs >= 0 && Number.isFinite(toleranceAbs))) throw new RangeError('decideConformity needs a tolerance of zero or more')
  if (!(expandedUncertainty >= 0 && Number.isFinite(expandedUncertainty))) throw new RangeError('decideConformity needs an expanded uncertainty of zero or more')
  const size = Math.abs(deviation)
  if (rule === 'simple') return size <= toleranceAbs ? 'pass' : 'fail'
  if (size + expandedUncertainty <= toleranceAbs) return 'pass'
  if (size - expandedUncertainty > toleranceAbs) return 'fail'
  return 'conditional'
}
