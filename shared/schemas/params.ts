import { z } from 'zod'

/** Route parameter `id`: every record id is a UUID; anything else is a 400, not a database error. */
export const IdParams = z.object({ id: z.string().uuid('That is not a valid id') })

/** `?inline=1` asks for a recording the page plays in place; anything else downloads it. */
export const AudioQuerySchema = z.object({ inline: z.enum(['0', '1'], { errorMap: () => ({ message: 'inline is 0 or 1' }) }).optional() })
