import { IdParams } from '#shared/schemas/params'
import { StrikeFieldsSchema } from '#shared/schemas/records'
import { parseWith } from '#shared/validation'

/** POST /api/pieces/:id/strikes: record one strike (multipart `file`, `temperatureC`, `humidityPct`, optional `calibration-id`). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'bench:strike')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const { file, fields } = await readUpload(event)
  const conditions = validateInput(StrikeFieldsSchema, Object.fromEntries(Object.entries(fields).filter(([, v]) => v.trim() !== '')))
  setResponseStatus(event, 201)
  return recordStrike(useDatabase(), useBlobStorage(), member, id, file, conditions, fields)
})
