/** POST /api/analyze: measure one uploaded strike (multipart `file` plus the CLI's options as fields); members who may record strikes. */
export default defineEventHandler(async (event) => {
  await requireMember(event, 'bench:strike')
  const { file, fields } = await readUpload(event)
  return sendJsonText(event, await analyzeUpload(file.bytes, fields))
})
