import { budgetLine } from './budgetLine'
import { combineBudget } from './combineBudget'
import { typeAStandardUncertainty } from './typeAStandardUncertainty'
import type { BudgetLine, Distribution, UncertaintyBudget } from './types'

/** d(cents)/d(ppm) at zero offset: 1200 / (ln 2 · 10⁶) ≈ 0.001731 ¢/ppm (derivative of 1200·log2(1 + x·10⁻⁶)). */
export const CENTS_PER_PPM = 1200 / (Math.LN2 * 1e6)

export interface PartialBudgetInput {
  /** The partial's deviation in cents in the last strikes at the piece's final state (Type A; fewer than two: no line). */
  readingsCents: readonly number[]
  /** The engine's one-standard-deviation uncertainty of the reading, ¢ (null: no line). */
  estimatorUncertaintyCents: number | null
  /** The input calibration's offset uncertainty, ppm, stated with `clockCoverageFactor` (default 1: a standard uncertainty); null: no calibration, no line. */
  clockUncertaintyPpm: number | null
  clockCoverageFactor?: number
  /** Largest drift of the input's clock since its calibration, ppm, taken as a rectangular half-width (0 or null: no line). */
  clockDriftPpm?: number | null
  /** Stated uncertainty of the bench temperature, K (°C differences), and how it is stated (default rectangular half-width). */
  temperatureUncertaintyK: number | null
  temperatureDistribution?: Distribution
  /** The template's temperature coefficient, ¢/K. */
  temperatureCoefficientCentsPerK: number
  /** Rounding step of the stored deviation, ¢ (a rectangular of full width one step: step/√12). */
  resolutionCents: number
}

/**
 * The uncertainty budget of one tuned partial's deviation in cents (JCGM 100:2008 §5.1, k = 2):
 * repeatability (Type A, §4.2), the estimator, the input clock (calibration and drift), the
 * bench temperature and the resolution of the stored result (Type B, §4.3). Components
 * with no evidence are left out rather than guessed.
 */
export function partialBudget(input: PartialBudgetInput): UncertaintyBudget {
  if (!(input.resolutionCents >= 0 && Number.isFinite(input.resolutionCents))) throw new RangeError('partialBudget needs a resolution of zero or more')
  if (!Number.isFinite(input.temperatureCoefficientCentsPerK)) throw new RangeError('partialBudget needs a finite temperature coefficient')
  const lines: BudgetLine[] = []
  const repeatability = typeAStandardUncertainty(input.readingsCents)
  if (repeatability !== null) lines.push(budgetLine({ name: 'repeatability', value: repeatability, unit: '¢', distribution: 'normal' }))
  if (input.estimatorUncertaintyCents !== null) {
    lines.push(budgetLine({ name: 'estimator', value: input.estimatorUncertaintyCents, unit: '¢', distribution: 'normal' }))
  }
  if (input.clockUncertaintyPpm !== null) {
    lines.push(budgetLine({ name: 'clock calibration', value: input.clockUncertaintyPpm, unit: 'ppm', distribution: 'normal', coverageFactor: input.clockCoverageFactor ?? 1, sensitivity: CENTS_PER_PPM }))
  }
  if (input.clockDriftPpm) {
    lines.push(budgetLine({ name: 'clock drift since calibration', value: Math.abs(input.clockDriftPpm), unit: 'ppm', distribution: 'rectangular', sensitivity: CENTS_PER_PPM }))
  }
  if (input.temperatureUncertaintyK !== null) {
    lines.push(budgetLine({ name: 'bench temperature', value: input.temperatureUncertaintyK, unit: 'K', distribution: input.temperatureDistribution ?? 'rectangular', sensitivity: input.temperatureCoefficientCentsPerK }))
  }
  // Full width one step is a half-width of step/2: (step/2)/√3 = step/√12.
  lines.push(budgetLine({ name: 'resolution', value: input.resolutionCents / 2, unit: '¢', distribution: 'rectangular' }))
  return combineBudget(lines, '¢')
}
