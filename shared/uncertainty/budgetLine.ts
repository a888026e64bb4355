import { distributionDivisor } from './distributionDivisor'
import type { BudgetLine, Distribution } from './types'

export interface BudgetLineInput {
  name: string
  value: number
  unit: string
  distribution: Distribution
  /** Sensitivity coefficient cᵢ (default 1: the input is already in the output's unit). */
  sensitivity?: number
  /** For a normal value: the k it was stated with (default 1, a standard deviation). */
  coverageFactor?: number
}

/** One budget line: uᵢ = value / divisor and contribution |cᵢ|·uᵢ (JCGM 100:2008 §5.1.3). */
export function budgetLine(input: BudgetLineInput): BudgetLine {
  const { name, value, unit, distribution } = input
  const sensitivity = input.sensitivity ?? 1
  if (!(value >= 0 && Number.isFinite(value))) throw new RangeError(`budgetLine needs a finite value of zero or more for ${name}`)
  if (!Number.isFinite(sensitivity)) throw new RangeError(`budgetLine needs a finite sensitivity for ${name}`)
  const divisor = distributionDivisor(distribution, input.coverageFactor ?? 1)
  const standardUncertainty = value / divisor
  return { name, value, unit, distribution, divisor, sensitivity, standardUncertainty, contribution: Math.abs(sensitivity) * standardUncertainty }
}
