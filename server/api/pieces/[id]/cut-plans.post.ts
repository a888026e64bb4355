import { IdParams } from '#shared/schemas/params'
import { CutPlanRequestSchema } from '#shared/schemas/savedCutPlan'
import { parseWith } from '#shared/validation'

/** POST /api/pieces/:id/cut-plans: plan cuts from the piece's latest strike (or `strikeId`) and save the plan; 201 new, 200 already saved. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'bench:strike')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(CutPlanRequestSchema))
  const { plan, created } = await saveCutPlan(useDatabase(), member, id, body)
  setResponseStatus(event, created ? 201 : 200)
  return plan
})
