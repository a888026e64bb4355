import type { DecisionRule, DecisionVerdict } from './types'

/** Each decision rule's short name and what it means, for the template form, the piece page and the certificate (ILAC-G8:09/2019 §4.2). */
export const DECISION_RULE_WORDS: Record<DecisionRule, { name: string, rule: string }> = {
  simple: { name: 'simple acceptance', rule: 'a partial passes when |Δ| ≤ tolerance; the measurement uncertainty is stated but not added to or taken from the tolerance' },
  guarded: { name: 'guarded acceptance', rule: 'a partial passes only when |Δ| + U ≤ tolerance, fails when |Δ| − U > tolerance, and is conditional when the tolerance lies within |Δ| ± U' },
}

/** How a verdict under a decision rule is written. */
export const DECISION_VERDICT_WORDS: Record<DecisionVerdict, string> = { pass: 'pass', conditional: 'conditional', fail: 'fail' }

const TIMES = ['', 'once', 'twice', 'three times']

/** "strike twice more before review": what the Bench and a refused review say. */
export function strikeMoreText(missing: number) {
  return `strike ${TIMES[missing] ?? `${missing} times`} more before review`
}
