import { WorkshopSettingsPatchSchema } from '#shared/schemas/workshop'
import { parseWith } from '#shared/validation'

/** PATCH /api/workshops/current/settings: change some of the workshop's settings (owner), audited. */
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'workshop:manage')
  const patch = await readValidatedBody(event, parseWith(WorkshopSettingsPatchSchema))
  return updateWorkshopSettings(useDatabase(), member, patch)
})
