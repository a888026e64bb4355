import { getHeader } from 'h3'
import { fail } from '../utils/http-errors'
import { hasBody, readBodyLimited, refuseTooLarge } from '../utils/request-body'
import { acceptsType, bodyPolicy, sizeText, TOO_LARGE_UPLOAD } from '../utils/request-limits'
import { crossSiteProblem } from '../utils/request-origin'

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

/**
 * Before any route runs, a state-changing request must come from our own pages
 * (or carry a bearer token), declare the body type its route takes (JSON, or
 * multipart on upload routes: 415 otherwise) and stay within the route's size:
 * JSON bodies are read here with a byte counter (413 as soon as they pass it);
 * uploads are read by readUpload after the route has checked who is asking.
 */
export default defineEventHandler(async (event) => {
  if (!STATE_CHANGING.has(event.method)) return
  const problem = crossSiteProblem(event, String(useRuntimeConfig().siteUrl ?? ''))
  if (problem) fail(403, problem)
  if (!hasBody(event)) return
  const policy = bodyPolicy(event.method, event.path.split('?')[0]!, getHeader(event, 'content-type'))
  if (!acceptsType(policy.kind, getHeader(event, 'content-type'))) {
    fail(415, policy.kind === 'upload'
      ? 'Send the recording as a multipart form (multipart/form-data) with a "file" field.'
      : 'This address takes a JSON body (Content-Type: application/json); forms and plain text are refused.')
  }
  if (policy.kind === 'upload') {
    const declared = Number.parseInt(getHeader(event, 'content-length') ?? '', 10)
    if (Number.isFinite(declared) && declared > policy.maxBytes) refuseTooLarge(event, TOO_LARGE_UPLOAD)
    return
  }
  try {
    await readBodyLimited(event, policy.maxBytes, `The request body is larger than ${sizeText(policy.maxBytes)}; send less at once.`)
  }
  catch (error) {
    if ((error as { statusCode?: number }).statusCode === 413) throw error
    fail(400, 'The request body could not be read; try sending it again.')
  }
})
