import { IdParams } from '#shared/schemas/params'
import { PdfQuerySchema } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/**
 * GET /api/certificates/:id/pdf: the stored PDF (A4), or `?paper=letter` for US Letter
 * from the frozen content. 202 with a plain sentence while the PDF is being rendered.
 */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'certificates:read')
  const { id } = await getValidatedRouterParams(event, parseWith(IdParams))
  const query = await getValidatedQuery(event, parseWith(PdfQuerySchema))
  const pdf = await certificatePdf(useDatabase(), useBlobStorage(), member.workshopId, id, query.paper === 'letter' ? 'LETTER' : 'A4')
  if (pdf.pending) {
    setResponseStatus(event, 202)
    setResponseHeader(event, 'retry-after', 2)
    return { statusCode: 202, pdfStatus: 'pending', message: `The PDF of certificate ${pdf.number} is still being prepared; try again in a few seconds.` }
  }
  setResponseHeaders(event, {
    'content-type': 'application/pdf',
    'content-disposition': `${query.download === '1' ? 'attachment' : 'inline'}; filename="${pdf.filename}"`,
    'x-content-type-options': 'nosniff',
  })
  return Buffer.from(pdf.bytes)
})
