/** GET /api/auth/session: who is signed in, the workshop they act in and their role. */
export default defineEventHandler(async (event) => {
  const member = await requireUser(event, { allowTemporaryPassword: true })
  const db = useDatabase()
  const workshops = await listUserWorkshops(db, member.userId)
  // The workshop's clock and units travel with the session, so every screen shows times in its zone.
  const settings = member.workshopId ? await getWorkshopSettings(db, member.workshopId) : null
  return {
    id: member.userId,
    email: member.email,
    name: member.name,
    workshopId: member.workshopId,
    workshopName: member.workshopName,
    role: member.role,
    mustChangePassword: member.mustChangePassword,
    workshops,
    settings,
  }
})
