/** GET /api/auth/session: who is signed in, the workshop they act in and their role. */
export default defineEventHandler(async (event) => {
  const member = await requireUser(event, { allowTemporaryPassword: true })
  const workshops = await listUserWorkshops(useDatabase(), member.userId)
  return {
    id: member.userId,
    email: member.email,
    name: member.name,
    workshopId: member.workshopId,
    workshopName: member.workshopName,
    role: member.role,
    mustChangePassword: member.mustChangePassword,
    workshops,
  }
})
