import { IdParams } from '#shared/schemas/params'
import { LotPatchSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** PATCH /api/lots/:id: correct a lot's fields (a listed species keeps its permit number). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'lots:manage')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(LotPatchSchema))
  return updateLot(useDatabase(), member.workshopId, member.userId, id, body)
})
