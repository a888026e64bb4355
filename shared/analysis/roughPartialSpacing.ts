import { bandNoiseFloor } from './bandNoiseFloor'
import { blackmanHarris } from './blackmanHarris'
import { nextPowerOfTwo } from './nextPowerOfTwo'
import { windowedPowerSpectrum } from './windowedPowerSpectrum'

/** What a first rough look at the strike says about its partials. */
export interface RoughPartials {
  /** Frequencies of the peaks found, in Hz, ascending. */
  frequenciesHz: number[]
  /** Level of each peak relative to the strongest, in dB (0 for the strongest). */
  relativeDb: number[]
  /** Smallest spacing between neighbouring peaks, in Hz (Infinity for a single peak). */
  spacingHz: number
  lowestHz: number
}

/**
 * First rough pass when no target is given: one Blackman–Harris spectrum over up to
 * `maxS` seconds from `startIndex`, zero-padded ×2, peaks 60 dB within the strongest and
 * 20 dB over the banded noise floor. Returns null when there is no peak at all.
 */
export function roughPartialSpacing(
  signal: Float64Array,
  sampleRate: number,
  startIndex: number,
  endIndex: number,
  maxS = 0.3,
): RoughPartials | null {
  const length = Math.min(endIndex - startIndex, Math.round(maxS * sampleRate))
  if (length < 64) return null
  const fftSize = nextPowerOfTwo(2 * length)
  const power = windowedPowerSpectrum(signal, startIndex, blackmanHarris(length), fftSize)
  const binHz = sampleRate / fftSize
  const kMin = Math.max(2, Math.ceil(20 / binHz))
  const kMax = Math.min(fftSize / 2 - 2, Math.floor((0.95 * sampleRate) / 2 / binHz))
  let maxPower = 0
  for (let k = kMin; k <= kMax; k++) maxPower = Math.max(maxPower, power[k]!)
  const floor = bandNoiseFloor(power, kMin, kMax, Math.ceil((3 * 8 * fftSize) / length))
  const frequenciesHz: number[] = []
  const relativeDb: number[] = []
  for (let k = kMin; k <= kMax; k++) {
    const p = power[k]!
    if (p > power[k - 1]! && p >= power[k + 1]! && p > maxPower * 1e-6 && p > floor[k]! * 100) {
      frequenciesHz.push(k * binHz)
      relativeDb.push(10 * Math.log10(p / maxPower))
    }
  }
  if (frequenciesHz.length === 0) return null
  let spacingHz = Infinity
  for (let i = 1; i < frequenciesHz.length; i++) spacingHz = Math.min(spacingHz, frequenciesHz[i]! - frequenciesHz[i - 1]!)
  return { frequenciesHz, relativeDb, spacingHz, lowestHz: frequenciesHz[0]! }
}
