/** POST /api/calibrations: measure a recorded reference tone (multipart `file`, `referenceHz`, `device`, optional `referenceUncertaintyPpm`) and keep the input's clock offset. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'bench:strike')
  const { file, fields } = await readUpload(event)
  setResponseStatus(event, 201)
  return createCalibration(useDatabase(), member.workshopId, member.userId, file.bytes, fields)
})
