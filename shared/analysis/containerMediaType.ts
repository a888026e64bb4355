import type { ContainerKind } from './detectContainer'

/** The media type and file extension the server gives a stored recording of each container (IANA names). */
export const CONTAINER_MEDIA: Readonly<Record<ContainerKind, { type: string, extension: string } | null>> = {
  wav: { type: 'audio/wav', extension: 'wav' },
  flac: { type: 'audio/flac', extension: 'flac' },
  mp3: { type: 'audio/mpeg', extension: 'mp3' },
  ogg: { type: 'audio/ogg', extension: 'ogg' },
  other: null,
}
