import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/pieces/:id/cut-plans: the piece's saved plans, newest first, with its geometry and the workshop's hand factor. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return listCutPlans(useDatabase(), member.workshopId, id)
})
