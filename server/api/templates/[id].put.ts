import { IdParams } from '#shared/schemas/params'
import { TemplateInputSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** PUT /api/templates/:id: save an edit as a new version (past verdicts keep theirs). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'templates:manage')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(TemplateInputSchema))
  return updateTemplate(useDatabase(), member.workshopId, member.userId, id, body)
})
