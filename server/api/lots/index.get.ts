/** GET /api/lots: the workshop's material lots. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'pieces:read')
  return listLots(useDatabase(), member.workshopId)
})
