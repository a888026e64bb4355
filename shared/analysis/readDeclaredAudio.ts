import type { AiffHeader } from './readAiffHeader'
import type { DeclaredAudio } from './declaredAudio'
import type { ContainerKind } from './detectContainer'
import { readFlacHeader } from './readFlacHeader'
import { readMp3Header } from './readMp3Header'
import { readOggHeader } from './readOggHeader'
import type { WavHeader } from './readWavHeader'

/**
 * What the container's header states (channels, rate, length), read before decoding.
 * Null when the header is not one Tonewright decodes (such a file is refused unread).
 */
export function readDeclaredAudio(bytes: Uint8Array, kind: ContainerKind, wav: WavHeader | null, aiff: AiffHeader | null = null): DeclaredAudio | null {
  if (kind === 'wav' && wav) return { codec: 'wav', channels: wav.channels, sampleRate: wav.sampleRate, frames: wav.frames, minDurationS: null }
  if (kind === 'aiff' && aiff) return { codec: 'aiff', channels: aiff.channels, sampleRate: aiff.sampleRate, frames: aiff.frames, minDurationS: null }
  if (kind === 'flac') return readFlacHeader(bytes)
  if (kind === 'ogg') return readOggHeader(bytes)
  if (kind === 'mp3') return readMp3Header(bytes)
  return null
}
