/** GET /api/templates: the workshop's ratio templates with their current version. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'templates:read')
  return listTemplates(useDatabase(), member.workshopId)
})
