import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/templates/:id: a template with its version history, newest first. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'templates:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return getTemplate(useDatabase(), member.workshopId, id)
})
