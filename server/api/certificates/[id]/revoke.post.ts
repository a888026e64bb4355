import { IdParams } from '#shared/schemas/params'
import { RevokeCertificateSchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** POST /api/certificates/:id/revoke: mark a certificate revoked, with a reason. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:sign')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const body = await readValidatedBody(event, parseWith(RevokeCertificateSchema))
  return revokeCertificate(useDatabase(), member, id, body.reason)
})
