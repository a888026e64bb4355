import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/pieces/:id/budget: the uncertainty budget per partial at the approved (else latest) strike and the verdict under the template's decision rule. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return { budget: await getPieceBudget(useDatabase(), member.workshopId, id) }
})
