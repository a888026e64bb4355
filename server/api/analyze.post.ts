/** POST /api/analyze: measure one uploaded strike (multipart `file`, the CLI's options as fields, optional `calibration-id`); members who may record strikes. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'bench:strike')
  const { file, fields } = await readUpload(event)
  return sendJsonText(event, await analyzeUpload(useDatabase(), member.workshopId, file.bytes, fields))
})
