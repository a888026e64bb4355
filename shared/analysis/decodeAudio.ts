import { AnalysisError } from './AnalysisError'
import { AUDIO_FORMAT_NAMES } from './audioFormats'
import { decodeBounded, type DecodedAudio } from './decodeBounded'
import { detectContainer } from './detectContainer'
import { LIMITS } from './limits'
import { AIFF_INTEGER_TYPES, AIFF_PCM_TYPES, readAiffHeader } from './readAiffHeader'
import { readDeclaredAudio } from './readDeclaredAudio'
import { readWavHeader } from './readWavHeader'

export type { DecodedAudio } from './decodeBounded'

/** Decoded audio and what the measurement should say about the file itself. */
export interface DecodedFile extends DecodedAudio {
  warnings: string[]
  /** Bit depth of integer PCM under 32 bits (WAV, AIFF), whose quantisation bounds what can be reported; null otherwise. */
  pcmBits: number | null
}

const NOT_AUDIO = `The file is not audio in a format Tonewright reads (${AUDIO_FORMAT_NAMES}).`

/**
 * Decode WAV (16/24-bit PCM, 32-bit float), FLAC, AIFF (uncompressed), MP3 or Ogg (Vorbis, Opus) bytes with
 * `audio-decode`, keeping the native sample rate. Refuses, with an AnalysisError and one
 * plain sentence, everything the engine cannot take: too large (413), empty, not audio,
 * truncated or corrupt (415), and audio outside the limits (422). The container's header
 * is checked before decoding (channels, rate and stated length), and decoding stops as
 * soon as the decoded audio passes 60 s, so a small file that expands to hours costs
 * almost nothing. A WAV or AIFF whose sample data is cut short, or a WAV that states no length,
 * is measured with a warning.
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
    // PCM, IEEE float and the extensible wrapper of either; compressed WAV is refused. First: a
    // compressed block holds many frames, so its length read as PCM is wrong (IMA ADPCM's 256-byte
    // blocks made 1.4 s read as 0.003 s, refused as too short).
    if (![1, 3, 0xfffe].includes(wav.formatTag)) {
      throw new AnalysisError(415, 'unsupported_audio', 'This WAV encoding is not supported; use 16-bit or 24-bit PCM or 32-bit float.')
    }
    checkLimits(wav.channels, wav.sampleRate, wav.frames)
    const warning = truncationWarning(wav.dataBytes, wav.dataBytesPresent, wav.blockAlign, wav.sampleRate)
    if (warning) warnings.push(warning)
    if (wav.dataBytes === 0 && wav.frames > 0) {
      warnings.push('the WAV header states no length for its audio (the recorder may not have finished the file); it was read to the end of the file')
    }
  }
  const aiff = readAiffHeader(bytes)
  if (aiff === 'corrupt') {
    throw new AnalysisError(415, 'corrupt_audio', 'The AIFF file is truncated or its header is damaged, so it cannot be read.')
  }
  if (aiff) {
    checkLimits(aiff.channels, aiff.sampleRate, aiff.frames)
    if (!AIFF_PCM_TYPES.has(aiff.compression) || aiff.bitsPerSample < 8 || aiff.bitsPerSample > 32) {
      throw new AnalysisError(415, 'unsupported_audio', 'This AIFF-C encoding is not supported; use uncompressed AIFF, WAV or FLAC.')
    }
    const warning = truncationWarning(aiff.framesDeclared * aiff.blockAlign, aiff.frames * aiff.blockAlign, aiff.blockAlign, aiff.sampleRate, 'AIFF')
    if (warning) warnings.push(warning)
  }
  const kind = detectContainer(bytes)
  const declared = readDeclaredAudio(bytes, kind, wav, aiff)
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
  return { channelData: decoded.channelData, sampleRate: decoded.sampleRate, warnings, pcmBits: pcmBitsOf(wav, aiff) }
}

/** Integer PCM under 32 bits states a quantisation step; float and 32-bit integer hold more than the engine reports. */
function pcmBitsOf(wav: ReturnType<typeof readWavHeader>, aiff: ReturnType<typeof readAiffHeader>): number | null {
  if (wav && wav !== 'corrupt') return wav.formatTag !== 3 && wav.bitsPerSample < 32 ? wav.bitsPerSample : null
  if (aiff && aiff !== 'corrupt') return AIFF_INTEGER_TYPES.has(aiff.compression) && aiff.bitsPerSample < 32 ? aiff.bitsPerSample : null
  return null
}

/**
 * The warning for sample data that declares more audio than the file holds (for WAV, 0 and
 * 0xFFFFFFFF are the placeholders of a recorder that streams, not a truncation).
 */
export function truncationWarning(dataBytes: number, dataBytesPresent: number, blockAlign: number, sampleRate: number, format = 'WAV'): string | null {
  if (dataBytes === 0 || dataBytes === 0xffffffff || dataBytesPresent >= dataBytes) return null
  const declaredS = dataBytes / blockAlign / sampleRate
  const presentS = dataBytesPresent / blockAlign / sampleRate
  return `truncated ${format} file: the header declares ${declaredS.toFixed(2)} s of audio but the file holds ${presentS.toFixed(2)} s; only that part was measured`
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
