import { defineEventHandler } from 'h3'
import { requireMember } from '../utils/auth'
import { useDatabase } from '../utils/db'
import { workshopCaughtMail } from '../utils/mailbox'
import { requireDevMailbox } from './guard'

/** GET /api/dev/mailbox: development only; the caught messages this workshop sent. */
export default defineEventHandler(async (event) => {
  const dir = requireDevMailbox()
  const member = await requireMember(event, 'workshop:read')
  return workshopCaughtMail(useDatabase(), dir, member.workshopId)
})
