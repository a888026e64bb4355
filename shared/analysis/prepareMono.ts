import { AnalysisError } from './AnalysisError'
import { alignChannels } from './alignChannels'
import { checkLimits } from './decodeAudio'
import { inspectLevels } from './inspectLevels'
import { LIMITS } from './limits'
import { mixToMono } from './mixToMono'

/**
 * A strike peaking under this, dB re full scale, was recorded too quietly: a recording is usually
 * set to peak around −12 dB (common practice), and 40 dB lower the format's and the input's own
 * noise covers the weaker partials.
 */
const QUIET_PEAK_DB = -40

/** The mono signal an analysis works on, with what was noticed on the way. */
export interface PreparedMono {
  mono: Float64Array
  /**
   * Level of the largest absolute sample of the mono signal analysed (its DC offset removed), dB
   * re full scale: no partial of the strike can be louder. An offset is no part of the strike, and counted in it
   * the bound would move with the audio interface (xylophone C5's fundamental, extrapolated back to
   * the blow 1.7 dB over the strike's own peak, passed the bound once the file carried 0.2 of DC, and
   * read 8.7 dB louder than without it).
   */
  peakDb: number
  warnings: string[]
}

/**
 * Check the decoded channels (limits, invalid samples, silence, clipping), mix them to
 * mono (a channel wired in opposite polarity inverted, a dead one left out, a later one
 * lined up with the loudest: alignChannels)
 * and remove the DC offset. Throws AnalysisError for audio that cannot be measured.
 */
export function prepareMono(channels: readonly ArrayLike<number>[], sampleRate: number): PreparedMono {
  const frames = channels[0]?.length ?? 0
  if (channels.length === 0) throw new AnalysisError(422, 'no_frames', 'The file holds no audio frames; the recording is empty.')
  checkLimits(channels.length, sampleRate, frames)
  const levels = inspectLevels(channels)
  if (levels.invalidSamples > 0) {
    throw new AnalysisError(415, 'corrupt_audio', 'The recording contains invalid sample values, so the file is damaged.')
  }
  if (levels.peak < LIMITS.silencePeak) throw silence()
  const warnings: string[] = []
  if (levels.clippedSamples > 0) warnings.push(`clipped samples: ${levels.clippedSamples} (the recording hit full scale, so levels read low and clipping adds lines of its own): turn the input gain down and strike again`)
  const { signs, lags } = channels.length > 1 ? alignChannels(channels, sampleRate) : { signs: undefined, lags: undefined }
  signs?.forEach((sign, k) => {
    if (sign === -1) warnings.push(`channel ${k + 1} is in opposite polarity to the loudest channel; it was inverted before mixing`)
    if (sign === 0) warnings.push(`channel ${k + 1} is silent or nearly so (40 dB or more under the loudest); it was left out of the mix`)
  })
  const mono = mixToMono(channels, signs, lags)
  let mean = 0
  for (let i = 0; i < mono.length; i++) mean += mono[i]!
  mean /= mono.length
  if (Math.abs(mean) > 0.01) warnings.push(`DC offset: ${mean.toFixed(3)} of full scale (removed before analysis, so the reading is unaffected; it takes that much headroom from the strike and usually comes from the audio interface's input: check it, or try another input)`)
  let peak = 0
  for (let i = 0; i < mono.length; i++) {
    mono[i]! -= mean
    peak = Math.max(peak, Math.abs(mono[i]!))
  }
  // A file that holds nothing but an offset is silent too.
  if (peak < LIMITS.silencePeak) throw silence()
  const peakDb = 20 * Math.log10(peak)
  if (peakDb < QUIET_PEAK_DB) warnings.push(`the strike peaks at ${peakDb.toFixed(1)} dB of full scale, so quietly that the recording's own noise covers its weaker partials: turn the input gain up (or bring the microphone closer) until it peaks around −12 dB, and strike again`)
  return { mono, peakDb, warnings }
}

function silence(): AnalysisError {
  return new AnalysisError(422, 'silent', 'The recording is silent; no strike can be heard in it.')
}
