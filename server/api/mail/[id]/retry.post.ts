import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** POST /api/mail/:id/retry: put a failed e-mail back in the queue. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:send')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  return answerQueued(event, 202, await retryMail(useDatabase(), member.workshopId, id), kickMailQueue)
})
