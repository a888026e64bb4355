import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** GET /api/sets/:id/mail: the e-mails sent about a set, with their delivery status. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  await getSet(useDatabase(), member.workshopId, id)
  return listSetMail(useDatabase(), member.workshopId, id)
})
