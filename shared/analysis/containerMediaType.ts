import { AUDIO_FORMATS } from './audioFormats'
import type { ContainerKind } from './detectContainer'

/** The media type and file extension the server gives a stored recording of this container (null: not one the engine reads). */
export function containerMedia(kind: ContainerKind): { type: string, extension: string } | null {
  const format = AUDIO_FORMATS.find(f => f.kind === kind)
  return format ? { type: format.mediaType, extension: format.extension } : null
}
