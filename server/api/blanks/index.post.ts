import { BlankRecordInputSchema } from '#shared/schemas/blankRecord'
import { parseWith } from '#shared/validation'

/** POST /api/blanks: grade a blank and record it (against its lot), with where it stands among the workshop's earlier blanks; 201. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'bench:strike')
  const body = await readValidatedBody(event, parseWith(BlankRecordInputSchema))
  const blank = await recordBlank(useDatabase(), member, body)
  setResponseStatus(event, 201)
  return blank
})
