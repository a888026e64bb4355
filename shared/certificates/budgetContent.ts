import type { z } from 'zod'
import type { CertificateBudgetSchema, CertificateCalibrationSchema, CertificateDecisionSchema } from '../schemas/certificateContent'
import type { PieceBudget } from '../uncertainty/evidence'
import { clockText } from '../uncertainty/clockText'
import { DECISION_RULE_WORDS } from '../uncertainty/ruleWords'
import type { DecisionRule } from '../uncertainty/types'

type FrozenBudget = z.output<typeof CertificateBudgetSchema>
type FrozenCalibration = z.output<typeof CertificateCalibrationSchema>
type FrozenDecision = z.output<typeof CertificateDecisionSchema>

/** Six significant digits: enough to re-add the budget by hand, stable in the hashed JSON. */
const sig = (v: number) => Number(v.toPrecision(6))

/** A piece's budgets as the certificate freezes them, one per partial found on the approved strike. */
export function frozenBudgets(budget: PieceBudget): FrozenBudget[] {
  return budget.partials.filter(p => p.budget !== null).map(p => ({
    label: p.label,
    lines: p.budget!.lines.map(l => ({
      name: l.name, value: sig(l.value), unit: l.unit, distribution: l.distribution, divisor: sig(l.divisor),
      sensitivity: sig(l.sensitivity), standardUncertainty: sig(l.standardUncertainty), contribution: sig(l.contribution),
    })),
    combinedStandardUncertaintyCents: sig(p.budget!.combinedStandardUncertainty),
    expandedUncertaintyCents: sig(p.budget!.expandedUncertainty),
    coverageFactor: p.budget!.coverageFactor,
    notAssessed: p.notAssessed,
  }))
}

export function frozenDecision(budget: PieceBudget): FrozenDecision {
  return { rule: budget.rule, verdict: budget.verdict, otherVerdict: budget.verdictUnderOtherRule, dependsOnRule: budget.dependsOnRule }
}

/** The input calibrations the pieces were measured under (one entry per calibration), and how many pieces had none. */
export function frozenCalibrations(budgets: PieceBudget[]): { calibrations: FrozenCalibration[], uncalibratedPieceCount: number } {
  const byKey = new Map<string, FrozenCalibration>()
  let uncalibratedPieceCount = 0
  for (const b of budgets) {
    const c = b.clock
    if (c.state === 'none') {
      uncalibratedPieceCount++
      continue
    }
    const key = `${c.device}|${c.calibratedAt}`
    const seen = byKey.get(key)
    if (seen) {
      seen.pieceCount++
      seen.expired ||= c.expired
      seen.driftAssessed &&= c.driftPpm !== null
      continue
    }
    byKey.set(key, { device: c.device, calibratedAt: c.calibratedAt, offsetPpm: sig(c.offsetPpm), uncertaintyPpm: sig(c.uncertaintyPpm), expired: c.expired, driftAssessed: c.driftPpm !== null, pieceCount: 1 })
  }
  const calibrations = [...byKey.values()].sort((a, b) => a.device.localeCompare(b.device) || a.calibratedAt.localeCompare(b.calibratedAt))
  return { calibrations, uncalibratedPieceCount }
}

export const frozenClock = (budget: PieceBudget) => clockText(budget.clock)

/** The decision rule paragraph, naming the rule (or rules, per template) the verdicts were given under (ILAC-G8:09/2019 §4.2). */
export function decisionRuleText(rulesByTemplate: Map<string, DecisionRule>): string {
  const rules = [...new Set(rulesByTemplate.values())].sort()
  const lead = 'A piece passes when every required partial of its ratio template is found and passes; partials marked "reported" are shown but do not decide the verdict.'
  const named = rules.length === 1
    ? ` Decision rule: ${DECISION_RULE_WORDS[rules[0]!].name}: ${DECISION_RULE_WORDS[rules[0]!].rule}.`
    : ` Decision rules, by template: ${[...rulesByTemplate.entries()].map(([t, r]) => `${DECISION_RULE_WORDS[r].name} for ${t}`).join('; ')}. ${rules.map(r => `${DECISION_RULE_WORDS[r].name[0]!.toUpperCase()}${DECISION_RULE_WORDS[r].name.slice(1)}: ${DECISION_RULE_WORDS[r].rule}.`).join(' ')}`
  return `${lead}${named} U is the expanded uncertainty of the deviation (k = 2) from the piece's budget in the annex. A piece whose verdict would differ under the other rule is marked so in the results.`
}
