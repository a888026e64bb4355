import { AnalysisError } from './AnalysisError'
import { decodeBounded, type DecodedAudio } from './decodeBounded'
import { detectContainer } from './detectContainer'
import { LIMITS } from './limits'
import { readDeclaredAudio } from './readDeclaredAudio'
import { readWavHeader } from './readWavHeader'

export type { DecodedAudio } from './decodeBounded'

/** Decoded audio and what the measurement should say about the file itself. */
export interface DecodedFile extends DecodedAudio {
  warnings: string[]
}

const NOT_AUDIO = 'The file is not audio in a format Tonewright reads (WAV, FLAC, MP3 or Ogg).'

/**
 * Decode WAV (16/24-bit PCM, 32-bit float), FLAC, MP3 or Ogg (Vorbis, Opus) bytes with
 * `audio-decode`, keeping the native sample rate. Refuses, with an AnalysisError and one
 * plain sentence, everything the engine cannot take: too large (413), empty, not audio,
 * truncated or corrupt (415), and audio outside the limits (422). The container's header
 * is checked before decoding (channels, rate and stated length), and decoding stops as
 * soon as the decoded audio passes 60 s, so a small file that expands to hours costs
 * almost nothing. A WAV whose data chunk is cut short, or states no length, is measured with a warning.
 */
export async function decodeAudio(bytes: Uint8Array): Promise<DecodedFile> {
  if (bytes.length > LIMITS.maxBytes) {
    throw new AnalysisError(413, 'too_large', 'The file is larger than 50 MB; record a single strike of at most 60 seconds.')
  }
  if (bytes.length === 0) throw new AnalysisError(415, 'empty_file', 'The file is empty; it contains no audio.')
  const wav = readWavHeader(bytes)
  if (wav === 'corrupt') {
    throw new AnalysisError(415, 'corrupt_audio', 'The WAV file is truncated or its header is damaged, so it cannot be read.')
  }
  const warnings: string[] = []
  if (wav) {
    checkLimits(wav.channels, wav.sampleRate, wav.frames)
    // PCM, IEEE float and the extensible wrapper of either; compressed WAV is refused.
    if (![1, 3, 0xfffe].includes(wav.formatTag)) {
      throw new AnalysisError(415, 'unsupported_audio', 'This WAV encoding is not supported; use 16-bit or 24-bit PCM or 32-bit float.')
    }
    const warning = truncationWarning(wav.dataBytes, wav.dataBytesPresent, wav.blockAlign, wav.sampleRate)
    if (warning) warnings.push(warning)
    if (wav.dataBytes === 0 && wav.frames > 0) {
      warnings.push('the WAV header states no length for its audio (the recorder may not have finished the file); it was read to the end of the file')
    }
  }
  const kind = detectContainer(bytes)
  const declared = readDeclaredAudio(bytes, kind, wav)
  if (!declared) {
    if (kind === 'flac' || kind === 'ogg') throw new AnalysisError(415, 'corrupt_audio', 'The audio file is damaged or truncated and cannot be decoded.')
    throw new AnalysisError(415, 'not_audio', NOT_AUDIO)
  }
  checkDeclared(declared.channels, declared.sampleRate, declared.frames, declared.minDurationS)
  let decoded: DecodedAudio
  try {
    decoded = await decodeBounded(bytes, declared.codec)
  }
  catch (error) {
    if (error instanceof AnalysisError) throw error
    throw new AnalysisError(415, 'corrupt_audio', 'The audio file is damaged or truncated and cannot be decoded.')
  }
  const channels = decoded.channelData.length
  if (channels === 0 || !(decoded.sampleRate > 0)) {
    throw new AnalysisError(415, 'corrupt_audio', 'The audio file is damaged or truncated and cannot be decoded.')
  }
  checkLimits(channels, decoded.sampleRate, decoded.channelData[0]!.length)
  return { channelData: decoded.channelData, sampleRate: decoded.sampleRate, warnings }
}

/**
 * The warning for a WAV data chunk that declares more audio than the file holds (0 and
 * 0xFFFFFFFF are the placeholders of a recorder that streams, not a truncation).
 */
export function truncationWarning(dataBytes: number, dataBytesPresent: number, blockAlign: number, sampleRate: number): string | null {
  if (dataBytes === 0 || dataBytes === 0xffffffff || dataBytesPresent >= dataBytes) return null
  const declaredS = dataBytes / blockAlign / sampleRate
  const presentS = dataBytesPresent / blockAlign / sampleRate
  return `truncated WAV file: the header declares ${declaredS.toFixed(2)} s of audio but the file holds ${presentS.toFixed(2)} s; only that part was measured`
}

/** The limits a header can state, checked before any decoding (422). */
export function checkDeclared(channels: number | null, sampleRate: number | null, frames: number | null, minDurationS: number | null): void {
  if (channels !== null && channels > LIMITS.maxChannels) {
    throw new AnalysisError(422, 'too_many_channels', `The recording has ${channels} channels; Tonewright takes at most 8.`)
  }
  if (sampleRate !== null && !(sampleRate >= LIMITS.minSampleRate && sampleRate <= LIMITS.maxSampleRate)) {
    throw new AnalysisError(422, 'bad_sample_rate', `The sample rate of ${sampleRate} Hz is outside the 8 kHz to 192 kHz that Tonewright measures.`)
  }
  const statedS = frames !== null && sampleRate ? frames / sampleRate : minDurationS
  if (statedS !== null && statedS > LIMITS.maxDurationS) {
    throw new AnalysisError(422, 'too_long', `The file says it lasts ${statedS.toFixed(1)} s; record a single strike of at most 60 seconds.`)
  }
}

/** Limits that make audio unmeasurable (422), in the order a benchmaker would fix them. */
export function checkLimits(channels: number, sampleRate: number, frames: number): void {
  checkDeclared(channels, sampleRate, null, null)
  if (frames === 0) throw new AnalysisError(422, 'no_frames', 'The file holds no audio frames; the recording is empty.')
  const durationS = frames / sampleRate
  if (durationS < LIMITS.minDurationS) {
    throw new AnalysisError(422, 'too_short', `The recording lasts ${durationS.toFixed(3)} s; record at least 0.2 s of the strike.`)
  }
  if (durationS > LIMITS.maxDurationS) {
    throw new AnalysisError(422, 'too_long', `The recording lasts ${durationS.toFixed(1)} s; record a single strike of at most 60 seconds.`)
  }
}
