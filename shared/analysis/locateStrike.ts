import { findStrike, type StrikeSpan } from './findStrike'

/**
 * The strike's span in a mono recording (findStrike), with two fall-backs: a sound that
 * never falls to a quiet background is analysed from its first loud moment to the end
 * (with a warning), and the span is never shorter than `minSpanS`.
 */
export function locateStrike(
  mono: Float64Array,
  sampleRate: number,
  settings: { attackSkipS: number, minProminenceDb: number, minSpanS: number },
  warnings: string[],
): StrikeSpan {
  const strike = findStrike(mono, sampleRate, { attackSkipS: settings.attackSkipS })
  if (strike.peakDb - strike.noiseFloorDb < settings.minProminenceDb) {
    // No quiet part to tell the strike from: the sound rings through the whole recording
    // (or there is no strike at all). Take the first loud sample as onset, analyse to the end.
    warnings.push('the sound never falls to a quiet background in this recording; analysed from its first loud moment to the end')
    const loud = 10 ** ((strike.peakDb - 30) / 20)
    let onset = 0
    while (onset < mono.length - 1 && Math.abs(mono[onset]!) <= loud) onset++
    strike.onsetIndex = onset
    strike.startIndex = Math.min(mono.length, onset + Math.round(settings.attackSkipS * sampleRate))
    strike.endIndex = mono.length
  }
  const minSpan = Math.round(settings.minSpanS * sampleRate)
  if (strike.endIndex - strike.startIndex < minSpan) {
    strike.endIndex = Math.min(mono.length, strike.startIndex + minSpan)
    strike.startIndex = Math.max(0, Math.min(strike.startIndex, strike.endIndex - minSpan))
  }
  return strike
}
