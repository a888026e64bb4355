/** GET /api/workshops/current/settings: the workshop's time zone, date locale, temperature unit and default reference pitch (every member). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'workshop:read')
  return getWorkshopSettings(useDatabase(), member.workshopId)
})
