import { analyzeChannels } from './analyzeChannels'
import { decodeAudio } from './decodeAudio'
import { detectContainer, isLossy } from './detectContainer'
import { validateAnalyzeOptions } from './parseAnalyzeOptions'
import type { AnalysisResult, AnalyzeOptions } from './types'

/**
 * Measure one strike from the bytes of an audio file (WAV, FLAC, AIFF, MP3, Ogg): decode,
 * mix to mono at the native rate, then the full pipeline. Resolves to the JSON contract;
 * rejects with AnalysisError (400 bad option, 413 too large, 415 not audio, 422 not
 * measurable) carrying one plain sentence.
 */
export async function analyzeStrike(bytes: Uint8Array, options: AnalyzeOptions = {}): Promise<AnalysisResult> {
  // Options first: a typo in a form field should not cost a decode.
  const opts = validateAnalyzeOptions(options)
  const decoded = await decodeAudio(bytes)
  const result = await analyzeChannels(decoded.channelData, decoded.sampleRate, opts, { lossy: isLossy(detectContainer(bytes)), pcmBits: decoded.pcmBits })
  // What decoding found about the file itself (e.g. a truncated WAV) comes first.
  if (decoded.warnings.length > 0) {
    result.warnings = [...decoded.warnings, ...result.warnings]
    result.advice = [...decoded.warnings, ...result.advice]
  }
  return result
}
