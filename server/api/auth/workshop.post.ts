import { SwitchWorkshopSchema } from '#shared/schemas/auth'
import { parseWith } from '#shared/validation'

/** POST /api/auth/workshop: switch this session to another workshop the user belongs to. */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { workshopId } = await readValidatedBody(event, parseWith(SwitchWorkshopSchema))
  const ok = await switchSessionWorkshop(useDatabase(), user.sessionId, user.userId, workshopId)
  if (!ok) fail(404, 'No such workshop.')
  return { workshopId }
})
