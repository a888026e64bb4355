import { channelSigns } from '../analysis/channelSigns'
import { decodeAudio } from '../analysis/decodeAudio'
import { mixToMono } from '../analysis/mixToMono'
import { measureClockOffset, type ClockOffset, type ClockOffsetOptions } from './measureClockOffset'

/**
 * The clock offset from the bytes of a recorded reference tone (WAV, FLAC, AIFF, MP3, Ogg): decoded
 * within the engine's limits (decodeAudio), mixed to mono as strikes are (a channel of the opposite
 * polarity inverted, a dead one left out: channelSigns), measured (measureClockOffset).
 * Rejects with AnalysisError and one plain sentence.
 */
export async function calibrateRecording(bytes: Uint8Array, referenceHz: number, options: ClockOffsetOptions = {}): Promise<ClockOffset> {
  const decoded = await decodeAudio(bytes)
  const channels = decoded.channelData
  const signs = channels.length > 1 ? channelSigns(channels) : undefined
  return measureClockOffset(mixToMono(channels, signs), decoded.sampleRate, referenceHz, options)
}
