/** GET /api/team: the current workshop's members. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'team:read')
  return listTeam(useDatabase(), member.workshopId)
})
