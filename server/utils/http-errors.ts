import { createError } from 'h3'
import type { ZodTypeAny, z } from 'zod'
import { plainSentence } from '../../shared/validation'

/**
 * The one status policy: 400 bad input, 401 not signed in, 403 role may not,
 * 404 not found or another workshop's, 409 conflicts with the current state,
 * 413 too large, 415 not a supported type, 422 readable but unusable, 429 slow down.
 * The message is one plain sentence for the person at the screen.
 */
export function fail(statusCode: 400 | 401 | 403 | 404 | 409 | 413 | 415 | 422 | 429 | 503, message: string): never {
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
