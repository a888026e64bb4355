import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** POST /api/mail/:id/retry: put a failed e-mail back in the queue. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:send')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const row = await retryMail(useDatabase(), member.workshopId, id)
  kickMailQueue()
  setResponseStatus(event, 202)
  return row
})
