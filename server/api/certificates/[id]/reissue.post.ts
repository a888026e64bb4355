import { IdParams } from '#shared/schemas/params'
import { ReissueCertificateSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** POST /api/certificates/:id/reissue: a new certificate from the set's current records supersedes this valid one, with a reason. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:sign')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(ReissueCertificateSchema))
  return answerQueued(event, 201, await reissueCertificate(useDatabase(), member, id, body.reason, siteUrlOf(event)), kickMailQueue)
})
