import type { DecisionRule, DecisionVerdict, UncertaintyBudget } from './types'

/**
 * A bench thermometer's assumed half-width when the workshop states none, K (a rectangular
 * ±0.5 °C: the usual accuracy printed on a workshop digital thermometer; from memory).
 */
export const ASSUMED_TEMPERATURE_HALF_WIDTH_K = 0.5

/** The stored deviation's rounding step, ¢ (certificates and the Bench show tenths of a cent). */
export const STORED_RESOLUTION_CENTS = 0.1

/** How many of a piece's last strikes at its final state the repeatability reads. */
export const FINAL_STATE_STRIKES_MAX = 5

/**
 * A strike whose fundamental reads further than this from the reference strike's, ¢, was made
 * before material was last taken off (a cut the Bench was not told of): the final state starts
 * after it. Repeat strikes of an unchanged bar agree to a few tenths of a cent; a finishing cut
 * moves it by a cent or more (common practice).
 */
export const FINAL_STATE_AGREEMENT_CENTS = 1.5

/** Strikes the workshop may ask for at the final state before a piece goes to review. */
export const STRIKES_BEFORE_REVIEW = 3

/** The input calibration a strike was measured under, as the budget needs it. */
export type ClockEvidence
  = | { state: 'none' }
    | {
      state: 'calibrated'
      device: string
      calibratedAt: string
      offsetPpm: number
      /** Standard uncertainty (k = 1) of the offset, ppm; the reference's own is part of it. */
      uncertaintyPpm: number
      referenceUncertaintyPpm: number
      expired: boolean
      /** Drift since the calibration from the device's history; null: fewer than two calibrations. */
      driftPpm: number | null
    }

/** A component the budget could not assess, and why (shown, never guessed). */
export interface NotAssessed {
  name: string
  reason: string
}

/** One tuned (or reported) partial's budget and what the decision rules make of it. */
export interface PartialBudgetResult {
  label: string
  required: boolean
  deviationCents: number | null
  toleranceCents: number
  /** Null when the partial was not found. */
  budget: UncertaintyBudget | null
  notAssessed: NotAssessed[]
  /** Readings the repeatability line rests on. */
  readingCount: number
  simple: DecisionVerdict | null
  guarded: DecisionVerdict | null
}

/** A piece's budgets, its verdict under its template's rule, and whether that verdict depends on the rule. */
export interface PieceBudget {
  rule: DecisionRule
  strikeCount: number
  clock: ClockEvidence
  temperatureRecorded: boolean
  partials: PartialBudgetResult[]
  /** Over the required partials: null while one is missing. */
  verdict: DecisionVerdict | null
  verdictUnderOtherRule: DecisionVerdict | null
  dependsOnRule: boolean
}

/**
 * Whether a partial's U may be stated: the engine's own estimate is the core of the budget, so a
 * partial measured by an engine that gave none has its other lines shown but no U claimed.
 */
export function statesExpandedUncertainty(notAssessed: readonly NotAssessed[]): boolean {
  return !notAssessed.some(g => g.name === 'estimator')
}
