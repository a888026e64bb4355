import type { ZodError, ZodTypeAny, z } from 'zod'

/** One plain sentence from the first problem zod found, naming the field. */
export function plainSentence(error: ZodError): string {
  const issue = error.issues[0]
  if (!issue) return 'The request could not be read.'
  const field = issue.path.join('.')
  const message = issue.message.endsWith('.') ? issue.message : `${issue.message}.`
  return field ? `${field}: ${message}` : message
}

/**
 * A validator for h3's readValidatedBody / getValidatedQuery: on failure it throws
 * an Error whose message is a plain sentence (h3 turns it into a 400 with that message).
 */
export function parseWith<S extends ZodTypeAny>(schema: S) {
  return (input: unknown): z.infer<S> => {
    const result = schema.safeParse(input)
    if (!result.success) throw new Error(plainSentence(result.error))
    return result.data
  }
}
