import type { CutPlan, CutPlanInput } from '../schemas/cutPlan'
import { planCuts } from './planCuts'

/** The planner on one validated `POST /api/cut-plan` body. */
export function planCutsForInput(input: CutPlanInput): CutPlan {
  const { partials, maxDepthMm, minThicknessMm, ...bar } = input
  return planCuts(bar, partials, { maxDepthMm, minThicknessMm })
}
