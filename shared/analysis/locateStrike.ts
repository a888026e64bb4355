import { findEarlierSound } from './findEarlierSound'
import { findSecondStrike } from './findSecondStrike'
import { findStrike, type StrikeSpan } from './findStrike'
import { energyBlockLength } from './units'

/** The strike's span, and what was noticed finding it. */
export interface LocatedStrike {
  strike: StrikeSpan
  warnings: string[]
}

/**
 * The strike's span in a mono recording (findStrike), with two fall-backs: a sound that
 * never falls to a quiet background is analysed from its first loud moment to the end
 * (with a warning), a second blow later in the file ends the span just before it (with a
 * warning: its sound would add to the first strike's decay), an earlier blow or loud sound passed
 * over for the louder strike is named (findEarlierSound), and the span is never shorter
 * than `minSpanS`.
 */
export function locateStrike(
  mono: Float64Array,
  sampleRate: number,
  settings: { attackSkipS: number, minProminenceDb: number, minSpanS: number },
): LocatedStrike {
  const found = findStrike(mono, sampleRate, { attackSkipS: settings.attackSkipS })
  const warnings: string[] = []
  let { onsetIndex, startIndex, endIndex } = found
  // The rise to the loudest moment may hold a blow of its own (a light tap, then the real
  // strike): the strike is the last blow before the loudest moment. A tremolo's or a beat's
  // swell is no blow, so the strike keeps the onset where the sound first rose.
  let passedOver: number | null = null
  for (let blow = laterBlow(mono, sampleRate, found, onsetIndex); blow !== null; blow = laterBlow(mono, sampleRate, found, onsetIndex)) {
    passedOver ??= onsetIndex
    onsetIndex = blow
    startIndex = Math.min(endIndex, blow + Math.round(settings.attackSkipS * sampleRate))
  }
  if (found.peakDb - found.noiseFloorDb < settings.minProminenceDb) {
    // No quiet part to tell the strike from: the sound rings through the whole recording
    // (or there is no strike at all). Take the first loud sample as onset, analyse to the end.
    warnings.push('the sound never falls to a quiet background in this recording; analysed from its first loud moment to the end')
    passedOver = null
    const loud = 10 ** ((found.peakDb - 30) / 20)
    onsetIndex = 0
    while (onsetIndex < mono.length - 1 && Math.abs(mono[onsetIndex]!) <= loud) onsetIndex++
    startIndex = Math.min(mono.length, onsetIndex + Math.round(settings.attackSkipS * sampleRate))
    endIndex = mono.length
  }
  // Said, because the earlier sound still rings under the strike and the benchmaker may have meant the first blow.
  const earlier = passedOver ?? findEarlierSound(mono, sampleRate, onsetIndex, found.peakDb)
  if (earlier !== null) {
    warnings.push(`an earlier blow or loud sound at ${(earlier / sampleRate).toFixed(2)} s was left out: the strike measured is the loudest, at ${(onsetIndex / sampleRate).toFixed(2)} s, and what still rings of the earlier one lies under it; record one strike per take`)
  }
  const second = findSecondStrike(mono, sampleRate, { onsetIndex, fromIndex: startIndex, toIndex: endIndex })
  if (second !== null) {
    // Two blocks (2 ms) before the rise, so no sample of the new blow is measured.
    endIndex = Math.max(startIndex, second - 2 * energyBlockLength(sampleRate))
    warnings.push(`a second strike at ${(second / sampleRate).toFixed(2)} s: only the first, up to ${(endIndex / sampleRate).toFixed(2)} s, was measured`)
  }
  const minSpan = Math.round(settings.minSpanS * sampleRate)
  if (endIndex - startIndex < minSpan) {
    endIndex = Math.min(mono.length, startIndex + minSpan)
    startIndex = Math.max(0, Math.min(startIndex, endIndex - minSpan))
  }
  return { strike: { ...found, onsetIndex, startIndex, endIndex }, warnings }
}

/** A blow after `onsetIndex` and before the strike's loudest moment (findSecondStrike), or null. */
function laterBlow(mono: Float64Array, sampleRate: number, found: StrikeSpan, onsetIndex: number): number | null {
  const toIndex = found.peakIndex + energyBlockLength(sampleRate)
  if (toIndex <= onsetIndex) return null
  return findSecondStrike(mono, sampleRate, { onsetIndex, fromIndex: onsetIndex + Math.round(sampleRate * 0.005), toIndex })
}
