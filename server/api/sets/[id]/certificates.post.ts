import { IdParams } from '#shared/schemas/params'
import { parseWith } from '#shared/validation'

/** POST /api/sets/:id/certificates: sign the certificate of a set whose pieces are all approved (409 if it has a valid one). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:sign')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  // The PDF job picks the new certificate up now rather than at the next sweep.
  return answerQueued(event, 201, await signCertificate(useDatabase(), member, id, siteUrlOf(event)), kickMailQueue)
})
