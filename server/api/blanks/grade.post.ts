import { BlankGradeInputSchema } from '#shared/schemas/blankGrade'
import { parseWith } from '#shared/validation'

/** POST /api/blanks/grade: density, stiffness and loss of a blank from its dimensions, mass and first mode; members who may strike. */
export default defineEventHandler(async (event) => {
  await requireMember(event, 'bench:strike')
  const body = await readValidatedBody(event, parseWith(BlankGradeInputSchema))
  return gradeBlankOffThread(body)
})
