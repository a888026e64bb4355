import type { H3Event } from 'h3'
import { getHeader, readMultipartFormData } from 'h3'
import { LIMITS } from '../../shared/analysis/limits'
import { fail } from './http-errors'

export interface UploadedFile { bytes: Uint8Array, filename: string, type: string }

/**
 * A multipart upload with one `file` part and plain text fields. Refuses bodies
 * over the engine's size limit before reading them (413), and a form without a file (400).
 */
export async function readUpload(event: H3Event): Promise<{ file: UploadedFile, fields: Record<string, string> }> {
  const length = Number(getHeader(event, 'content-length') ?? '0')
  if (length > LIMITS.maxBytes + 1024 * 1024) fail(413, 'The file is larger than 50 MB; record a shorter strike or use a compressed format.')
  const type = getHeader(event, 'content-type') ?? ''
  if (!type.startsWith('multipart/form-data')) fail(400, 'Send the recording as a multipart form with a "file" field.')
  let parts: Awaited<ReturnType<typeof readMultipartFormData>>
  try {
    parts = await readMultipartFormData(event)
  }
  catch {
    fail(400, 'The upload could not be read; try sending it again.')
  }
  const fields: Record<string, string> = {}
  let file: UploadedFile | null = null
  for (const part of parts ?? []) {
    if (!part.name) continue
    if (part.name === 'file' && part.filename !== undefined) {
      file = { bytes: new Uint8Array(part.data.buffer, part.data.byteOffset, part.data.byteLength), filename: part.filename, type: part.type ?? '' }
    }
    else if (part.filename === undefined) fields[part.name] = part.data.toString('utf8')
  }
  if (!file) fail(400, 'Choose a recording to upload (the form has no "file").')
  if (file.bytes.byteLength > LIMITS.maxBytes) fail(413, 'The file is larger than 50 MB; record a shorter strike or use a compressed format.')
  return { file, fields }
}
