/** GET /api/calibrations: each input device's calibrations, newest first (current one and drift history), with expiry under the workshop's interval. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'bench:strike')
  return listCalibrations(useDatabase(), member.workshopId)
})
