import { LatestReanalysisQuery } from '#shared/schemas/reanalysis'
import { parseWith } from '#shared/validation'

/** GET /api/reanalysis?set=ID or ?piece=ID: `{ run }`, the latest re-measurement of that set or piece (null when none). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const query = await getValidatedQuery(event, parseWith(LatestReanalysisQuery))
  return latestReanalysis(useDatabase(), member.workshopId, query)
})
