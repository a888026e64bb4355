/** POST /api/analyze: measure one uploaded strike (multipart `file` plus the CLI's options as fields). */
export default defineEventHandler(async (event) => {
  await requireMember(event)
  const { file, fields } = await readUpload(event)
  return analyzeUpload(file.bytes, fields)
})
