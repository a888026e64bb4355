import decode from 'audio-decode'
import { AnalysisError } from './AnalysisError'
import type { DeclaredAudio } from './declaredAudio'
import { LIMITS } from './limits'

export interface DecodedAudio {
  channelData: Float32Array[]
  sampleRate: number
}

/** Decoded bytes one call may produce, roughly: the next input slice is sized to it. */
const OUTPUT_BUDGET_BYTES = 8 * 1024 * 1024
/** The first slice is small: a crafted file can expand a few bytes into a whole block. */
const FIRST_SLICE_BYTES = 256
const MAX_SLICE_BYTES = 1024 * 1024

const DECODERS = { wav: decode.wav, flac: decode.flac, aiff: decode.aiff, mp3: decode.mp3, vorbis: decode.oga, opus: decode.opus }

/**
 * Decodes in slices with audio-decode's streaming decoders and stops as soon as the
 * decoded length passes the duration limit (422), so a file that hides hours of audio
 * behind a small size or a false header costs at most one slice past 60 s. Each slice is
 * sized from the expansion seen so far so that one call stays near OUTPUT_BUDGET_BYTES.
 * Throws whatever the decoder throws on damaged input (the caller words it).
 */
export async function decodeBounded(bytes: Uint8Array, codec: DeclaredAudio['codec']): Promise<DecodedAudio> {
  const decoder = await DECODERS[codec]()
  const parts: Float32Array[][] = []
  let sampleRate = 0
  let frames = 0
  let done = false
  const take = (out: { channelData: Float32Array[], sampleRate: number }) => {
    if (out.channelData.length === 0 || out.channelData[0]!.length === 0) return
    if (parts.length > 0 && (out.channelData.length !== parts[0]!.length || out.sampleRate !== sampleRate)) {
      throw new AnalysisError(415, 'corrupt_audio', 'The audio changes its channels or sample rate part-way through; record one strike as one plain file.')
    }
    sampleRate = out.sampleRate
    if (out.channelData.length > LIMITS.maxChannels) {
      throw new AnalysisError(422, 'too_many_channels', `The recording has ${out.channelData.length} channels; Tonewright takes at most 8.`)
    }
    parts.push(out.channelData)
    frames += out.channelData[0]!.length
    if (sampleRate > 0 && frames / sampleRate > LIMITS.maxDurationS) {
      throw new AnalysisError(422, 'too_long', `The recording lasts more than ${LIMITS.maxDurationS} s; record a single strike of at most 60 seconds.`)
    }
  }
  try {
    let offset = 0
    let slice = FIRST_SLICE_BYTES
    let decodedBytes = 0
    while (offset < bytes.length) {
      const end = Math.min(bytes.length, offset + slice)
      const out = await decoder(bytes.subarray(offset, end))
      take(out)
      offset = end
      decodedBytes += out.channelData.length * (out.channelData[0]?.length ?? 0) * 4
      const expansion = Math.max(1, decodedBytes / offset)
      slice = Math.max(FIRST_SLICE_BYTES, Math.min(MAX_SLICE_BYTES, Math.floor(OUTPUT_BUDGET_BYTES / expansion)))
    }
    done = true
    take(await decoder())
  }
  finally {
    if (!done) decoder.free()
  }
  return { channelData: join(parts, frames), sampleRate }
}

function join(parts: Float32Array[][], frames: number): Float32Array[] {
  if (parts.length === 1) return parts[0]!
  const channels = parts[0]?.length ?? 0
  return Array.from({ length: channels }, (_, c) => {
    const out = new Float32Array(frames)
    let at = 0
    for (const part of parts) {
      out.set(part[c]!, at)
      at += part[c]!.length
    }
    return out
  })
}
