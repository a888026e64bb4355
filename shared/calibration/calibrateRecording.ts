import { decodeAudio } from '../analysis/decodeAudio'
import { mixToMono } from '../analysis/mixToMono'
import { measureClockOffset, type ClockOffset, type ClockOffsetOptions } from './measureClockOffset'

/**
 * The clock offset from the bytes of a recorded reference tone (WAV, FLAC, MP3, Ogg): decoded
 * within the engine's limits (decodeAudio), mixed to mono, measured (measureClockOffset).
 * Rejects with AnalysisError and one plain sentence.
 */
export async function calibrateRecording(bytes: Uint8Array, referenceHz: number, options: ClockOffsetOptions = {}): Promise<ClockOffset> {
  const decoded = await decodeAudio(bytes)
  return measureClockOffset(mixToMono(decoded.channelData), decoded.sampleRate, referenceHz, options)
}
