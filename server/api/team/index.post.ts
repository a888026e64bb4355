import { AddMemberSchema } from '#shared/schemas/auth'
import { parseWith } from '#shared/validation'

/**
 * POST /api/team: add a member with a role and a temporary password (owner only).
 * An address that already has an account is sent an invitation instead; the answer is the same.
 */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'team:manage')
  const body = await readValidatedBody(event, parseWith(AddMemberSchema))
  return answerQueued(event, 201, await addMember(useDatabase(), member, body, siteUrlOf(event), useRuntimeConfig().authSecret), kickMailQueue)
})
