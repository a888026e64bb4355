import decode from 'audio-decode'
import { AnalysisError } from './AnalysisError'
import { LIMITS } from './limits'
import { readWavHeader } from './readWavHeader'

/** Decoded audio at its native rate, one Float32Array per channel. */
export interface DecodedAudio {
  channelData: Float32Array[]
  sampleRate: number
}

/**
 * Decode WAV (16/24-bit PCM, 32-bit float), FLAC, MP3 or Ogg bytes with `audio-decode`,
 * keeping the native sample rate. Refuses, with an AnalysisError and one plain sentence,
 * everything the engine cannot take: too large (413), empty, not audio, truncated or
 * corrupt (415), and audio outside the limits (422). A WAV header is checked before
 * decoding so a huge or exotic file costs nothing.
 */
export async function decodeAudio(bytes: Uint8Array): Promise<DecodedAudio> {
  if (bytes.length > LIMITS.maxBytes) {
    throw new AnalysisError(413, 'too_large', 'The file is larger than 50 MB; record a single strike of at most 60 seconds.')
  }
  if (bytes.length === 0) throw new AnalysisError(415, 'empty_file', 'The file is empty; it contains no audio.')
  const wav = readWavHeader(bytes)
  if (wav === 'corrupt') {
    throw new AnalysisError(415, 'corrupt_audio', 'The WAV file is truncated or its header is damaged, so it cannot be read.')
  }
  if (wav) {
    checkLimits(wav.channels, wav.sampleRate, wav.frames)
    // PCM, IEEE float and the extensible wrapper of either; compressed WAV is refused.
    if (![1, 3, 0xfffe].includes(wav.formatTag)) {
      throw new AnalysisError(415, 'unsupported_audio', 'This WAV encoding is not supported; use 16-bit or 24-bit PCM or 32-bit float.')
    }
  }
  let decoded: DecodedAudio
  try {
    decoded = await decode(bytes)
  }
  catch (error) {
    const text = error instanceof Error ? error.message : ''
    if (/unknown audio format/i.test(text)) {
      throw new AnalysisError(415, 'not_audio', 'The file is not audio in a format Tonewright reads (WAV, FLAC, MP3 or Ogg).')
    }
    throw new AnalysisError(415, 'corrupt_audio', 'The audio file is damaged or truncated and cannot be decoded.')
  }
  const channels = decoded?.channelData?.length ?? 0
  if (!decoded || channels === 0 || !(decoded.sampleRate > 0)) {
    throw new AnalysisError(415, 'corrupt_audio', 'The audio file is damaged or truncated and cannot be decoded.')
  }
  checkLimits(channels, decoded.sampleRate, decoded.channelData[0]!.length)
  return { channelData: decoded.channelData, sampleRate: decoded.sampleRate }
}

/** Limits that make audio unmeasurable (422), in the order a benchmaker would fix them. */
export function checkLimits(channels: number, sampleRate: number, frames: number): void {
  if (channels > LIMITS.maxChannels) {
    throw new AnalysisError(422, 'too_many_channels', `The recording has ${channels} channels; Tonewright takes at most 8.`)
  }
  if (!(sampleRate >= LIMITS.minSampleRate && sampleRate <= LIMITS.maxSampleRate)) {
    throw new AnalysisError(422, 'bad_sample_rate', `The sample rate of ${sampleRate} Hz is outside the 8 kHz to 192 kHz that Tonewright measures.`)
  }
  if (frames === 0) throw new AnalysisError(422, 'no_frames', 'The file holds no audio frames; the recording is empty.')
  const durationS = frames / sampleRate
  if (durationS < LIMITS.minDurationS) {
    throw new AnalysisError(422, 'too_short', `The recording lasts ${durationS.toFixed(3)} s; record at least 0.2 s of the strike.`)
  }
  if (durationS > LIMITS.maxDurationS) {
    throw new AnalysisError(422, 'too_long', `The recording lasts ${durationS.toFixed(1)} s; record a single strike of at most 60 seconds.`)
  }
}
