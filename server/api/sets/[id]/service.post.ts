import { IdParams } from '#shared/schemas/params'
import { ServiceBookingSchema } from '#shared/schemas/service'
import { parseWith } from '#shared/validation'

/** POST /api/sets/:id/service: book a shipped set in for retuning or repair; its pieces go back to tuning. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'sets:manage')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(ServiceBookingSchema))
  setResponseStatus(event, 201)
  return bookService(useDatabase(), member, id, body)
})
