import { CreateWorkshopSchema } from '#shared/schemas/auth'
import { parseWith } from '#shared/validation'

/** POST /api/workshops: a signed-in user opens another workshop, as its owner. */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { name } = await readValidatedBody(event, parseWith(CreateWorkshopSchema))
  const workshop = await useDatabase().transaction(tx => createWorkshopFor(tx, user.userId, name, addStarterTemplates))
  setResponseStatus(event, 201)
  return { id: workshop.id, name: workshop.name }
})
