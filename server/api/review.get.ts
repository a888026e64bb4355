/** GET /api/review: the review queue, oldest first, each with its latest strike's matches. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:decide')
  return reviewQueue(useDatabase(), member.workshopId)
})
