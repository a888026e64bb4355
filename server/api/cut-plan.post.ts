import { CutPlanInputSchema } from '#shared/schemas/cutPlan'
import { parseWith } from '#shared/validation'

/** POST /api/cut-plan: where to cut a bar and how deep to bring its tuned partials into tolerance; members who may strike. */
export default defineEventHandler(async (event) => {
  await requireMember(event, 'bench:strike')
  const body = await readValidatedBody(event, parseWith(CutPlanInputSchema))
  return planCutsOffThread(body)
})
