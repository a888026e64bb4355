import type { CutPlan, CutPlanInput } from '../schemas/cutPlan'
import { planCuts } from './planCuts'

/** The planner on one validated `POST /api/cut-plan` body, with the workshop's hand factor when one is known. */
export function planCutsForInput(input: CutPlanInput, handFactor?: number): CutPlan {
  const { partials, maxDepthMm, minThicknessMm, ...bar } = input
  return planCuts(bar, partials, { maxDepthMm, minThicknessMm, handFactor })
}
