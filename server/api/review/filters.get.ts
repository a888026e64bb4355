/** GET /api/review/filters: the sets and benchmakers with pieces in the review queue, for its filters. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:decide')
  return reviewFilters(useDatabase(), member.workshopId)
})
