import { BlankThresholdsPutSchema } from '#shared/schemas/blankThresholds'
import { parseWith } from '#shared/validation'

/** PUT /api/workshops/current/blank-thresholds: replace the workshop's own thresholds per species (owner), audited. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'workshop:manage')
  const { thresholds } = await readValidatedBody(event, parseWith(BlankThresholdsPutSchema))
  return putBlankThresholds(useDatabase(), member, thresholds)
})
