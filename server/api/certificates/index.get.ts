import { CertificateListQuerySchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** GET /api/certificates: the workshop's certificates, newest first (optionally `?set=`, `?q=` a buyer, serial or number). */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:read')
  const query = await getValidatedQuery(event, parseWith(CertificateListQuerySchema))
  return listCertificates(useDatabase(), member.workshopId, query)
})
