/** GET /api/workshops/current/blank-thresholds: the workshop's own blank-grading thresholds per species, beside the starting ones (owner). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'workshop:manage')
  return getBlankThresholds(useDatabase(), member.workshopId)
})
