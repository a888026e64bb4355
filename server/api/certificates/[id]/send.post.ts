import { IdParams } from '#shared/schemas/params'
import { SendCertificateSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** POST /api/certificates/:id/send: queue the certificate e-mail (to the buyer unless `to` is given). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:send')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(SendCertificateSchema))
  return answerQueued(event, 202, await sendCertificate(useDatabase(), member, id, body.to), kickMailQueue)
})
