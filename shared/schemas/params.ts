import { z } from 'zod'

/** Route parameter `id`: every record id is a UUID; anything else is a 400, not a database error. */
export const IdParams = z.object({ id: z.string().uuid('That is not a valid id') })
