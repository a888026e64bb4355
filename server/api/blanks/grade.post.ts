import { BlankGradeInputSchema } from '#shared/schemas/blankGrade'
import { parseWith } from '#shared/validation'

/**
 * POST /api/blanks/grade: density, stiffness and loss of a blank from its dimensions, mass and first
 * mode (JSON `f1Hz`, or a multipart `file` of its strike with the figures as fields); members who may strike.
 */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'bench:strike')
  const thresholds = await workshopBlankThresholds(useDatabase(), member.workshopId)
  if (mediaType(getHeader(event, 'content-type')) === 'multipart/form-data') {
    const { file, fields } = await readUpload(event)
    return gradeBlankStrike(file.bytes, fields, thresholds)
  }
  const body = await readValidatedBody(event, parseWith(BlankGradeInputSchema))
  return gradeBlankOffThread(body, thresholds)
})
