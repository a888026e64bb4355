import { IdParams } from '#shared/schemas/params'
import { SendCertificateSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** GET /api/certificates/:id/mail-preview: the e-mail the sender would send (`?to=` another address), without sending it. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:send')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const query = await getValidatedQuery(event, parseWith(SendCertificateSchema))
  const { cert, to, mail } = await prepareCertificateMail(useDatabase(), member.workshopId, id, query.to)
  return { certificateId: cert.id, number: cert.number, to, subject: mail.subject, text: mail.text, html: mail.html, attachment: `${cert.number}.pdf` }
})
