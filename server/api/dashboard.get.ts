/** GET /api/dashboard: the workshop at a glance (stages per set, review queue, yield, strikes this week). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'workshop:read')
  return dashboardFor(useDatabase(), member.workshopId)
})
