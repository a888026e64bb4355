import { BlankListQuerySchema } from '#shared/schemas/blankRecord'
import { parseWith } from '#shared/validation'

/** GET /api/blanks: the workshop's graded blanks, newest first (`?species=`, `?lotId=` to narrow). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const filter = await getValidatedQuery(event, parseWith(BlankListQuerySchema))
  return listBlanks(useDatabase(), member.workshopId, filter)
})
