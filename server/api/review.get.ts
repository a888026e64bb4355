import { ReviewQuerySchema } from '#shared/schemas/review'
import { parseWith } from '#shared/validation'

/** GET /api/review?set=&benchmaker=: the review queue, oldest first, each with its latest strike's matches. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:decide')
  const { set, benchmaker } = await getValidatedQuery(event, parseWith(ReviewQuerySchema))
  return reviewQueue(useDatabase(), member.workshopId, { set, benchmaker })
})
