import { TemplateInputSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/templates: a new ratio template (version 1). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'templates:manage')
  const body = await readValidatedBody(event, parseWith(TemplateInputSchema))
  setResponseStatus(event, 201)
  return createTemplate(useDatabase(), member.workshopId, member.userId, body)
})
