import { CreateSetSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/sets: a new set; its note range becomes its pieces in one transaction. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'sets:manage')
  const body = await readValidatedBody(event, parseWith(CreateSetSchema))
  setResponseStatus(event, 201)
  return createSet(useDatabase(), member.workshopId, member.userId, body)
})
