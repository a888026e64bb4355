import type { H3Event } from 'h3'
import { setResponseStatus } from 'h3'

/**
 * Answers a request whose work a background queue does (an e-mail, a PDF, a
 * re-measurement): wakes that queue now rather than at its next sweep, and answers
 * with `status` (201 for a record made, 202 for work accepted).
 */
export function answerQueued<T>(event: H3Event, status: 201 | 202, value: T, kickQueue: () => void): T {
  kickQueue()
  setResponseStatus(event, status)
  return value
}
