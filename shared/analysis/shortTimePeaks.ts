import { cachedBlackmanHarris } from './cachedBlackmanHarris'
import { parabolicPeak } from './parabolicPeak'
import { realFft } from './realFft'
import { bandNoiseFloor } from './bandNoiseFloor'
import { trailingFloor } from './trailingFloor'

/** One spectral peak of one frame. */
export interface SpectralPeak {
  frequencyHz: number
  /** Peak amplitude of the sinusoid, dB re full scale (window gain removed). */
  amplitudeDb: number
  /** Local noise floor under the peak, same dB scale (level of a sinusoid as strong as the floor). */
  noiseFloorDb: number
  /** Phase of the FFT bin at the peak, in rad, referenced to the frame start. */
  phaseRad: number
}

/** Peaks of one short-time spectrum. */
export interface SpectrumFrame {
  /** Centre of the frame, in s from the start of the signal. */
  timeS: number
  peaks: SpectralPeak[]
}

export interface ShortTimeSettings {
  windowLength: number
  fftSize: number
  hop: number
  startIndex: number
  endIndex: number
  /** Peaks more than this far below the frame's strongest peak are ignored, in dB (e.g. 80). */
  peakThresholdDb: number
  /** Peaks must stand this far above the local noise floor, in dB (e.g. 20). */
  noiseMarginDb: number
  /** The floor may fall this far under the banded floor to the lowest a later frame showed, dB (trailingFloor; 0 = off). */
  maxFloorReliefDb?: number
  minFrequencyHz: number
  maxFrequencyHz: number
}

/**
 * Short-time Fourier transform (Blackman–Harris window, zero-padded FFT) of
 * `signal[startIndex…endIndex)` and its spectral peaks: local maxima of the power above
 * both thresholds (relative to the frame's strongest peak, and over the noise floor: the
 * banded floor, lowered to the lowest a later frame showed — trailingFloor), refined by
 * parabolic interpolation of the dB magnitude.
 */
export function shortTimePeaks(signal: Float64Array, sampleRate: number, settings: ShortTimeSettings): SpectrumFrame[] {
  const { windowLength, fftSize, hop } = settings
  if (fftSize < windowLength || hop < 1) throw new RangeError('fftSize must cover the window and hop must be ≥ 1')
  const window = cachedBlackmanHarris(windowLength)
  let windowSum = 0
  for (let i = 0; i < windowLength; i++) windowSum += window[i]!
  // |X| of a sinusoid of amplitude A is A·Σw/2: this turns power into dB of amplitude.
  const gainDb = 20 * Math.log10(2 / windowSum)
  const binHz = sampleRate / fftSize
  const kMin = Math.max(2, Math.ceil(settings.minFrequencyHz / binHz))
  const kMax = Math.min(fftSize / 2 - 2, Math.floor(settings.maxFrequencyHz / binHz))
  const frames: SpectrumFrame[] = []
  if (kMax <= kMin) return frames

  const { buffer, spectrum, power, floor, trailing } = scratchFor(fftSize, kMax + 2)
  // The window fills the start of the frame; the rest is the zero padding (another call may have written there).
  buffer.fill(0, windowLength)
  // Three main lobes of the zero-padded window: a band is never filled by one partial.
  const minBandBins = Math.ceil((3 * 8 * fftSize) / windowLength)
  const relative = 10 ** (-settings.peakThresholdDb / 10)
  const margin = 10 ** (settings.noiseMarginDb / 10)

  // Last frame first, so each frame's floor can be the lowest any later frame showed (trailingFloor).
  trailing.fill(Infinity)
  const last = settings.startIndex + Math.floor((settings.endIndex - windowLength - settings.startIndex) / hop) * hop
  for (let start = last; start >= settings.startIndex; start -= hop) {
    windowInto(signal, start, window, buffer)
    realFft(buffer, spectrum)
    const maxPower = powerSpectrum(spectrum, kMin, kMax, power)
    bandNoiseFloor(power, kMin, kMax, minBandBins, floor)
    trailingFloor(floor, trailing, kMin, kMax, settings.maxFloorReliefDb ?? 0)
    const threshold = { relative: Math.max(maxPower * relative, Number.MIN_VALUE), margin }
    const peaks: SpectralPeak[] = []
    for (let k = nextCandidate(power, floor, kMin, kMax, threshold); k <= kMax; k = nextCandidate(power, floor, k + 1, kMax, threshold)) {
      const p = power[k]!
      const vertex = parabolicPeak(10 * Math.log10(power[k - 1]!), 10 * Math.log10(p), 10 * Math.log10(power[k + 1]!))
      peaks.push({
        frequencyHz: (k + vertex.offset) * binHz,
        amplitudeDb: vertex.value + gainDb,
        noiseFloorDb: 10 * Math.log10(Math.max(floor[k]!, Number.MIN_VALUE)) + gainDb,
        phaseRad: Math.atan2(spectrum[2 * k + 1]!, spectrum[2 * k]!),
      })
    }
    frames.push({ timeS: (start + windowLength / 2) / sampleRate, peaks })
  }
  return frames.reverse()
}

// The per-frame loops are functions of their own, so each is compiled whole (not entered mid-way).

/** `signal[start…)` times the window, into the start of `buffer`. */
function windowInto(signal: Float64Array, start: number, window: Float64Array, buffer: Float64Array): void {
  for (let i = 0; i < window.length; i++) buffer[i] = signal[start + i]! * window[i]!
}

/** |X[k]|² for k in kMin − 1 … kMax + 1 into `power`; returns the largest within kMin … kMax. */
function powerSpectrum(spectrum: Float64Array, kMin: number, kMax: number, power: Float64Array): number {
  let maxPower = 0
  for (let k = kMin - 1; k <= kMax + 1; k++) {
    const re = spectrum[2 * k]!
    const im = spectrum[2 * k + 1]!
    const p = re * re + im * im
    power[k] = p
    if (k >= kMin && k <= kMax && p > maxPower) maxPower = p
  }
  return maxPower
}

/** The first bin from `from` on (or kMax + 1) that is a local maximum over both thresholds: the relative one and `margin` times the floor. */
function nextCandidate(power: Float64Array, floor: Float64Array, from: number, kMax: number, threshold: { relative: number, margin: number }): number {
  const { relative, margin } = threshold
  for (let k = from; k <= kMax; k++) {
    const p = power[k]!
    if (p <= relative || p <= floor[k]! * margin || p <= power[k - 1]! || p < power[k + 1]!) continue
    return k
  }
  return kMax + 1
}

/** Work arrays of the transform, kept between calls (an analysis makes a few STFTs of the same sizes; fresh ones cost collections). */
interface Scratch {
  buffer: Float64Array
  spectrum: Float64Array
  power: Float64Array
  floor: Float64Array
  trailing: Float64Array
}
const scratches = new Map<number, Scratch>()

/** The work arrays for one transform size, `bins` long where per bin; written before they are read on every call. */
function scratchFor(fftSize: number, bins: number): Scratch {
  let s = scratches.get(fftSize)
  if (!s || s.power.length < bins) {
    s = { buffer: new Float64Array(fftSize), spectrum: new Float64Array(2 * fftSize), power: new Float64Array(bins), floor: new Float64Array(bins), trailing: new Float64Array(bins) }
    // A few sizes per analysis; a recording at another rate brings others.
    if (scratches.size >= 8) scratches.delete(scratches.keys().next().value!)
    scratches.set(fftSize, s)
  }
  return s
}
