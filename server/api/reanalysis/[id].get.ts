import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/reanalysis/:id: a re-measurement's status and, as it goes, what changed piece by piece. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return getReanalysisRun(useDatabase(), member.workshopId, id)
})
