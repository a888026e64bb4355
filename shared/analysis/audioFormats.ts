import type { ContainerKind } from './detectContainer'

/** One audio format Tonewright reads. */
export interface AudioFormat {
  kind: Exclude<ContainerKind, 'other'>
  /** Its name for people. */
  label: string
  /** The media type a stored recording is served with. */
  mediaType: string
  /** The extension a stored recording gets. */
  extension: string
  /** File-name extensions it arrives with. */
  fileExtensions: readonly string[]
}

/** The formats the engine decodes, in the order they are named to people. */
export const AUDIO_FORMATS: readonly AudioFormat[] = [
  { kind: 'wav', label: 'WAV', mediaType: 'audio/wav', extension: 'wav', fileExtensions: ['wav'] },
  { kind: 'flac', label: 'FLAC', mediaType: 'audio/flac', extension: 'flac', fileExtensions: ['flac'] },
  { kind: 'aiff', label: 'AIFF', mediaType: 'audio/aiff', extension: 'aiff', fileExtensions: ['aif', 'aiff', 'aifc'] },
  { kind: 'mp3', label: 'MP3', mediaType: 'audio/mpeg', extension: 'mp3', fileExtensions: ['mp3'] },
  { kind: 'ogg', label: 'Ogg', mediaType: 'audio/ogg', extension: 'ogg', fileExtensions: ['ogg', 'oga', 'opus'] },
]

const labels = AUDIO_FORMATS.map(f => f.label)

/** "WAV, FLAC, AIFF, MP3 or Ogg". */
export const AUDIO_FORMAT_NAMES = `${labels.slice(0, -1).join(', ')} or ${labels.at(-1)}`

/** The `accept` attribute of a file input that takes a recording. */
export const AUDIO_FILE_ACCEPT = ['audio/*', ...AUDIO_FORMATS.flatMap(f => f.fileExtensions.map(e => `.${e}`))].join(',')

/** The extension a recording called `fileName` is stored under ('bin' when its name says no format). */
export function storedAudioExtension(fileName: string): string {
  const ext = fileName.includes('.') ? fileName.split('.').pop()!.toLowerCase() : ''
  return AUDIO_FORMATS.find(f => f.fileExtensions.includes(ext))?.extension ?? 'bin'
}
