/** Container/codec family of an audio file, from its first bytes. */
export type ContainerKind = 'wav' | 'flac' | 'aiff' | 'mp3' | 'ogg' | 'other'

/** True for containers whose usual codecs are lossy (their artefacts look like weak partials). */
export function isLossy(kind: ContainerKind): boolean {
  return kind === 'mp3' || kind === 'ogg' || kind === 'other'
}

/** Recognise WAV, FLAC, AIFF (and AIFF-C), MP3 (ID3 tag or frame sync) and Ogg by their magic bytes. */
export function detectContainer(bytes: Uint8Array): ContainerKind {
  const tag = (offset: number, text: string) => [...text].every((ch, i) => bytes[offset + i] === ch.charCodeAt(0))
  if (bytes.length >= 12 && tag(0, 'RIFF') && tag(8, 'WAVE')) return 'wav'
  if (tag(0, 'fLaC')) return 'flac'
  if (bytes.length >= 12 && tag(0, 'FORM') && (tag(8, 'AIFF') || tag(8, 'AIFC'))) return 'aiff'
  if (tag(0, 'OggS')) return 'ogg'
  if (tag(0, 'ID3') || (bytes[0] === 0xff && ((bytes[1] ?? 0) & 0xe0) === 0xe0)) return 'mp3'
  return 'other'
}
