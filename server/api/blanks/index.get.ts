import { BlankListQuerySchema } from '#shared/schemas/blankRecord'
import { parseWith } from '#shared/validation'

/** GET /api/blanks: the workshop's graded blanks, newest first (`?species=` for one species). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  const { species } = await getValidatedQuery(event, parseWith(BlankListQuerySchema))
  return listBlanks(useDatabase(), member.workshopId, species)
})
