import { defineEventHandler, getValidatedRouterParams, setResponseHeader } from 'h3'
import { MailboxParams } from '../../shared/schemas/certificates'
import { parseWith } from '../../shared/validation'
import { requireMember } from '../utils/auth'
import { useDatabase } from '../utils/db'
import { fail } from '../utils/http-errors'
import { workshopCaughtAttachment } from '../utils/mailbox'
import { requireDevMailbox } from './guard'

/** GET /api/dev/mailbox/:id/:file: development only; one attachment of a message this workshop sent. */
export default defineEventHandler(async (event) => {
  const dir = requireDevMailbox()
  const member = await requireMember(event, 'workshop:read')
  const { id, file } = await getValidatedRouterParams(event, parseWith(MailboxParams))
  const found = await workshopCaughtAttachment(useDatabase(), dir, member.workshopId, id, file)
  if (!found) fail(404, 'No such attachment.')
  const pdf = found.attachment.filename.endsWith('.pdf')
  setResponseHeader(event, 'content-type', pdf ? 'application/pdf' : 'application/octet-stream')
  setResponseHeader(event, 'x-content-type-options', 'nosniff')
  setResponseHeader(event, 'content-disposition', `${pdf ? 'inline' : 'attachment'}; filename="${found.attachment.filename}"`)
  return found.bytes
})
