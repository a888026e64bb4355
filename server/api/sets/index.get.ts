/** GET /api/sets: the workshop's sets with piece counts by stage. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'sets:read')
  return listSets(useDatabase(), member.workshopId)
})
