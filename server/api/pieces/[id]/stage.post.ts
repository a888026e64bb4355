import { IdParams } from '#shared/schemas/params'
import { StageChangeSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/pieces/:id/stage: move a piece to another stage (with `via`, through that stage in one transaction). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:stage')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const { to, via, reason } = await readValidatedBody(event, parseWith(StageChangeSchema))
  return changeStage(useDatabase(), member, id, to, reason, via)
})
