import { MailboxParams } from '#shared/schemas/certificates'
import { parseWith } from '#shared/validation'

/** GET /api/dev/mailbox/:id/:file: development only; one attachment of a caught message. */
export default defineEventHandler(async (event) => {
  const dir = requireDevMailbox()
  await requireMember(event, 'workshop:read')
  const { id, file } = await getValidatedRouterParams(event, parseWith(MailboxParams))
  const bytes = await caughtAttachment(dir, id, file)
  setResponseHeader(event, 'content-type', file.endsWith('.pdf') ? 'application/pdf' : 'application/octet-stream')
  setResponseHeader(event, 'content-disposition', `inline; filename="${file}"`)
  return bytes
})
