import { IdParams } from '#shared/schemas/params'
import { UpdateSetSchema } from '#shared/schemas/setEdit'
import { parseWith } from '#shared/validation'

/** PATCH /api/sets/:id: change a set's buyer, serial, model, due date or notes (office, owner; audited). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'sets:manage')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(UpdateSetSchema))
  return updateSet(useDatabase(), member.workshopId, member.userId, id, body)
})
