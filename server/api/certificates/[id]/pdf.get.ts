import { IdParams } from '#shared/schemas/params'
import { PdfQuerySchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** GET /api/certificates/:id/pdf: the signed PDF (A4), or `?paper=letter` for US Letter from the frozen content. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const query = await getValidatedQuery(event, parseWith(PdfQuerySchema))
  const pdf = await certificatePdf(useDatabase(), useBlobStorage(), member.workshopId, id, query.paper === 'letter' ? 'LETTER' : 'A4')
  setResponseHeaders(event, {
    'content-type': 'application/pdf',
    'content-disposition': `${query.download === '1' ? 'attachment' : 'inline'}; filename="${pdf.filename}"`,
    'x-content-type-options': 'nosniff',
  })
  return Buffer.from(pdf.bytes)
})
