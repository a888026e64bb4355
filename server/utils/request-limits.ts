import { LIMITS } from '../../shared/analysis/limits'

/** Room for a multipart form's boundaries, part headers and the few text fields beside the file. */
const FORM_OVERHEAD_BYTES = 256 * 1024

/** Request body limits, enforced while the body arrives (server/middleware/request-guard.ts, readUpload). */
export const BODY_LIMITS = {
  /** A JSON body of a signed-in route. */
  jsonBytes: 1024 * 1024,
  /** A JSON body of a route open to anyone (sign-in, sign-up, invitations, resets, verification). */
  publicJsonBytes: 64 * 1024,
  /** A whole multipart upload: the engine's file limit plus the form around it. */
  uploadBytes: LIMITS.maxBytes + FORM_OVERHEAD_BYTES,
} as const

export const TOO_LARGE_UPLOAD = 'The file is larger than 50 MB; record a shorter strike or use a compressed format.'

/** Routes that take a multipart upload (a recording); every other route with a body takes JSON. */
const UPLOAD_ROUTES: readonly { method: string, path: RegExp }[] = [
  { method: 'POST', path: /^\/api\/pieces\/[^/]+\/strikes$/ },
  { method: 'POST', path: /^\/api\/analyze$/ },
  { method: 'POST', path: /^\/api\/calibrations$/ },
]

/** Routes that take either JSON or a multipart upload (a recording), told apart by the Content-Type. */
const JSON_OR_UPLOAD_ROUTES: readonly { method: string, path: RegExp }[] = [
  { method: 'POST', path: /^\/api\/blanks\/grade$/ },
]

/** Routes anyone may call without signing in. */
const PUBLIC_PREFIXES = ['/api/auth/', '/api/invitations/', '/api/verify/']

export type BodyKind = 'upload' | 'json'

export interface BodyPolicy { kind: BodyKind, maxBytes: number }

/** What body a request may carry, from its method and path (without the query), and on a route that takes either, its Content-Type. */
export function bodyPolicy(method: string, path: string, contentType?: string): BodyPolicy {
  const multipart = mediaType(contentType) === 'multipart/form-data'
  const either = multipart && JSON_OR_UPLOAD_ROUTES.some(r => r.method === method && r.path.test(path))
  if (either || UPLOAD_ROUTES.some(r => r.method === method && r.path.test(path))) return { kind: 'upload', maxBytes: BODY_LIMITS.uploadBytes }
  const open = PUBLIC_PREFIXES.some(p => path.startsWith(p))
  return { kind: 'json', maxBytes: open ? BODY_LIMITS.publicJsonBytes : BODY_LIMITS.jsonBytes }
}

/** A media type without its parameters, lower case. */
export function mediaType(contentType: string | undefined): string {
  return (contentType ?? '').split(';')[0]!.trim().toLowerCase()
}

/** Whether a body's declared type suits the route: JSON for JSON routes, multipart for uploads. */
export function acceptsType(kind: BodyKind, contentType: string | undefined): boolean {
  const type = mediaType(contentType)
  return kind === 'upload' ? type === 'multipart/form-data' : type === 'application/json' || /^application\/[\w.-]+\+json$/.test(type)
}

/** Readable size for messages: "64 kB", "1 MB". */
export function sizeText(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${Math.round(bytes / (1024 * 1024))} MB` : `${Math.round(bytes / 1024)} kB`
}
