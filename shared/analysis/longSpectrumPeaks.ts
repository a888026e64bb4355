import { blackmanHarris } from './blackmanHarris'
import { bandNoiseFloor } from './bandNoiseFloor'
import { MAIN_LOBE_BINS } from './chooseWindow'
import { nextPowerOfTwo } from './nextPowerOfTwo'
import { parabolicPeak } from './parabolicPeak'
import { windowedPowerSpectrum } from './windowedPowerSpectrum'

/** One peak of a long spectrum. */
export interface LongPeak {
  frequencyHz: number
  /** Amplitude of a steady sinusoid that would give this peak, dB re full scale (window gain removed). */
  levelDb: number
  /** Banded noise floor under the peak (bandNoiseFloor), same scale. */
  noiseFloorDb: number
  /**
   * Topographic prominence: how far the peak stands over the deepest dip between it and the
   * nearest higher bin on either side (the higher of the two dips), dB; searched
   * `prominenceReachHz` each way, past which the floor stands in for the dip.
   */
  prominenceDb: number
}

export interface LongSpectrumSettings {
  startIndex: number
  /** Samples in the window. */
  length: number
  minFrequencyHz: number
  maxFrequencyHz: number
  /** Peaks more than this far under the strongest one are not returned, dB. */
  belowStrongestDb: number
  /** Peaks must stand this far over the banded floor, dB. */
  noiseMarginDb: number
  /** How far a dip is searched for on each side, Hz (default: 8 main lobes of the window). */
  prominenceReachHz?: number
}

/**
 * Peaks of one long spectrum: `signal[start … start + length)` times a 4-term Blackman–Harris
 * window (Harris 1978), zero-padded to a power of two at least 1.25 × the length (the
 * main lobe then spans ten or more bins, so a peak's bin is found; parabolic interpolation
 * of the dB magnitude, Grandke 1983, places it within a few hundredths of a lobe). Local
 * maxima within `belowStrongestDb` of the strongest and `noiseMarginDb` over the
 * banded floor are returned by ascending frequency, each with its prominence.
 */
export function longSpectrumPeaks(signal: Float64Array, sampleRate: number, settings: LongSpectrumSettings): LongPeak[] {
  const { startIndex, length } = settings
  if (!(Number.isInteger(length) && length >= 64 && startIndex >= 0 && startIndex + length <= signal.length)) {
    throw new RangeError('longSpectrumPeaks needs a span of at least 64 samples inside the signal')
  }
  const fftSize = nextPowerOfTwo(Math.ceil(1.25 * length))
  const window = blackmanHarris(length)
  let windowSum = 0
  for (let i = 0; i < length; i++) windowSum += window[i]!
  const binHz = sampleRate / fftSize
  const kMin = Math.max(2, Math.ceil(settings.minFrequencyHz / binHz))
  const kMax = Math.min(fftSize / 2 - 2, Math.floor(settings.maxFrequencyHz / binHz))
  if (kMax <= kMin) return []
  const power = windowedPowerSpectrum(signal, startIndex, window, fftSize)
  const floor = bandNoiseFloor(power, kMin, kMax, Math.ceil((3 * MAIN_LOBE_BINS * fftSize) / length))
  // |X| of a sinusoid of amplitude A is A·Σw/2.
  const gainDb = 20 * Math.log10(2 / windowSum)
  const db = (k: number) => 10 * Math.log10(power[k]! + Number.MIN_VALUE) + gainDb
  let strongest = 0
  for (let k = kMin; k <= kMax; k++) strongest = Math.max(strongest, power[k]!)
  const relative = strongest * 10 ** (-settings.belowStrongestDb / 10)
  const margin = 10 ** (settings.noiseMarginDb / 10)
  const reach = Math.round((settings.prominenceReachHz ?? (8 * MAIN_LOBE_BINS * sampleRate) / length) / binHz)
  const peaks: LongPeak[] = []
  for (let k = kMin; k <= kMax; k++) {
    const p = power[k]!
    if (!(p > power[k - 1]! && p >= power[k + 1]! && p >= relative && p >= margin * floor[k]!)) continue
    const vertex = parabolicPeak(db(k - 1), db(k), db(k + 1))
    const dip = (direction: 1 | -1) => {
      let lowest = p
      for (let j = k + direction, n = 0; j >= kMin && j <= kMax && n < reach; j += direction, n++) {
        if (power[j]! > p) return lowest
        lowest = Math.min(lowest, power[j]!)
      }
      return Math.min(lowest, floor[k]!)
    }
    const dipPower = Math.max(dip(-1), dip(1))
    peaks.push({
      frequencyHz: (k + vertex.offset) * binHz,
      levelDb: vertex.value,
      noiseFloorDb: 10 * Math.log10(floor[k]! + Number.MIN_VALUE) + gainDb,
      prominenceDb: 10 * Math.log10(p / Math.max(dipPower, Number.MIN_VALUE)),
    })
  }
  return peaks
}
