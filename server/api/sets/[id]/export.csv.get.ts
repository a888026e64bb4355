import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/sets/:id/export.csv: the set's results, one row per piece and tuned partial, units in the header. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'sets:export')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const { filename, csv } = await exportSetCsv(useDatabase(), member.workshopId, id)
  setResponseHeaders(event, {
    'content-type': 'text/csv; charset=utf-8; header=present',
    'content-disposition': `attachment; filename="${filename}"`,
    'x-content-type-options': 'nosniff',
    'cache-control': 'no-store',
  })
  return csv
})
