import type { H3Event } from 'h3'
import { getHeader } from 'h3'
import { LIMITS } from '../../shared/analysis/limits'
import { fail } from './http-errors'
import { boundaryOf, parseMultipart } from './multipart-parse'
import { readBodyLimited } from './request-body'
import { BODY_LIMITS, mediaType, TOO_LARGE_UPLOAD } from './request-limits'

export interface UploadedFile { bytes: Uint8Array, filename: string, type: string }

/**
 * A multipart upload with one `file` part and plain text fields. The body is
 * read with a byte counter (413 as soon as it passes the limit, also when it
 * comes chunked), then split without copying; a form without a file is 400.
 */
export async function readUpload(event: H3Event): Promise<{ file: UploadedFile, fields: Record<string, string> }> {
  const contentType = getHeader(event, 'content-type') ?? ''
  if (mediaType(contentType) !== 'multipart/form-data') fail(415, 'Send the recording as a multipart form (multipart/form-data) with a "file" field.')
  const boundary = boundaryOf(contentType)
  if (!boundary) fail(400, 'The upload could not be read: its form has no boundary.')
  let body: Buffer
  try {
    body = await readBodyLimited(event, BODY_LIMITS.uploadBytes, TOO_LARGE_UPLOAD)
  }
  catch (error) {
    if ((error as { statusCode?: number }).statusCode === 413) throw error
    fail(400, 'The upload could not be read; try sending it again.')
  }
  const parts = parseMultipart(body, boundary)
  if (!parts) fail(400, 'The upload could not be read; try sending it again.')
  const fields: Record<string, string> = {}
  let file: UploadedFile | null = null
  for (const part of parts) {
    if (part.name === 'file' && part.filename !== undefined) {
      file = { bytes: new Uint8Array(part.data.buffer, part.data.byteOffset, part.data.byteLength), filename: part.filename, type: part.type ?? '' }
    }
    else if (part.filename === undefined) fields[part.name] = part.data.toString('utf8')
  }
  if (!file) fail(400, 'Choose a recording to upload (the form has no "file").')
  if (file.bytes.byteLength > LIMITS.maxBytes) fail(413, TOO_LARGE_UPLOAD)
  return { file, fields }
}
