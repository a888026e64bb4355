import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** POST /api/sets/:id/certificates: sign (or re-issue) the certificate of a set whose pieces are all approved. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:sign')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const signed = await signCertificate(useDatabase(), useBlobStorage(), member, id, siteUrlOf(event))
  setResponseStatus(event, 201)
  return signed
})
