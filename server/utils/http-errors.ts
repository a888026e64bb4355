import { createError } from 'h3'
import type { ZodTypeAny, z } from 'zod'
import { plainSentence } from '../../shared/validation'

/**
 * The one status policy: 400 bad input, 401 not signed in, 403 role may not,
 * 404 not found or another workshop's, 409 conflicts with the current state,
 * 413 too large, 415 not a supported type, 416 a byte range that cannot be served,
 * 422 readable but unusable, 429 slow down.
 * The message is one plain sentence for the person at the screen.
 */
export function fail(statusCode: 400 | 401 | 403 | 404 | 409 | 413 | 415 | 416 | 422 | 429 | 503, message: string): never {
  throw createError({ statusCode, statusMessage: STATUS_TEXT[statusCode], message })
}

const STATUS_TEXT: Record<number, string> = {
  400: 'Bad Request',
  401: 'Unauthorized',
  403: 'Forbidden',
  404: 'Not Found',
  409: 'Conflict',
  413: 'Payload Too Large',
  415: 'Unsupported Media Type',
  416: 'Range Not Satisfiable',
  422: 'Unprocessable Entity',
  429: 'Too Many Requests',
  503: 'Service Unavailable',
}

/** Validates data that did not come through readValidatedBody (e.g. multipart fields): 400 with a plain sentence. */
export function validateInput<S extends ZodTypeAny>(schema: S, data: unknown): z.infer<S> {
  const result = schema.safeParse(data)
  if (!result.success) fail(400, plainSentence(result.error))
  return result.data
}

/** The PostgreSQL error behind a failed query (Drizzle wraps it in `cause`). */
function databaseErrorOf(error: unknown): { code?: string, constraint_name?: string } | null {
  for (let e = error, depth = 0; e && typeof e === 'object' && depth < 5; e = (e as { cause?: unknown }).cause, depth++) {
    if (typeof (e as { code?: unknown }).code === 'string') return e as { code: string, constraint_name?: string }
  }
  return null
}

/** True for a unique violation (SQLSTATE 23505), of the named constraint when one is given. */
export function isUniqueViolation(error: unknown, constraint?: string): boolean {
  const db = databaseErrorOf(error)
  return db?.code === '23505' && (!constraint || db.constraint_name === constraint)
}

/**
 * Runs `work` (typically a whole transaction) and turns a unique violation into
 * 409 with the caller's sentence. Checking first is not enough: two requests can
 * both pass the check, and the database's constraint decides which one wins.
 */
export async function conflictOnDuplicate<T>(work: () => Promise<T>, sentence: string, constraint?: string): Promise<T> {
  try {
    return await work()
  }
  catch (error) {
    if (isUniqueViolation(error, constraint)) fail(409, sentence)
    throw error
  }
}
