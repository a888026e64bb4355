/** How the spread of a budget component is described (JCGM 100:2008 §4.3). */
export const DISTRIBUTIONS = ['normal', 'rectangular', 'triangular'] as const
export type Distribution = (typeof DISTRIBUTIONS)[number]

/** Decision rules after ILAC-G8:09/2019 §4.2: simple acceptance and guarded acceptance (guard band w = U). */
export const DECISION_RULES = ['simple', 'guarded'] as const
export type DecisionRule = (typeof DECISION_RULES)[number]

export const DECISION_VERDICTS = ['pass', 'conditional', 'fail'] as const
export type DecisionVerdict = (typeof DECISION_VERDICTS)[number]

/** Coverage factor for an expanded uncertainty of about 95 % (JCGM 100:2008 §6.3.3). */
export const COVERAGE_FACTOR = 2

/** One line of an uncertainty budget, in the form of JCGM 100:2008 §5.1 / EA-4/02. */
export interface BudgetLine {
  name: string
  /** The stated value: a half-width (rectangular, triangular), an expanded uncertainty (normal, with divisor k) or a standard deviation (divisor 1). */
  value: number
  unit: string
  distribution: Distribution
  /** What `value` is divided by to give the standard uncertainty (√3, √6 or k). */
  divisor: number
  /** Sensitivity coefficient cᵢ: output unit per input unit. */
  sensitivity: number
  /** uᵢ = value / divisor, in `unit`. */
  standardUncertainty: number
  /** |cᵢ|·uᵢ, in the output's unit. */
  contribution: number
}

/** A budget: its lines, the combined standard uncertainty u and the expanded uncertainty U = k·u. */
export interface UncertaintyBudget {
  lines: BudgetLine[]
  unit: string
  combinedStandardUncertainty: number
  coverageFactor: number
  expandedUncertainty: number
}
