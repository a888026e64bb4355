import { IdParams } from '#shared/schemas/params'
import { ReanalyzeSchema } from '#shared/schemas/reanalysis'
import { parseWith } from '#shared/validation'

/** POST /api/pieces/:id/reanalyze: queue a re-measurement of the piece's strikes with the current engine (202, poll statusUrl). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'strikes:reanalyze')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(ReanalyzeSchema))
  const run = await requestReanalysis(useDatabase(), member, { pieceId: id }, body.reason)
  kickReanalysisQueue()
  setResponseStatus(event, 202)
  return run
})
