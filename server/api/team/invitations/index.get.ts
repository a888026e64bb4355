/** GET /api/team/invitations: the invitations still waiting for an answer (owner only). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'team:manage')
  return listPendingInvitations(useDatabase(), member.workshopId)
})
