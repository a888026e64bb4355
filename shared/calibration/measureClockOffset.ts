import { AnalysisError } from '../analysis/AnalysisError'
import { basebandDtft } from '../analysis/basebandDtft'
import { BLACKMAN_HARRIS_COEFFICIENTS } from '../analysis/blackmanHarris'
import { inputBand } from '../analysis/inputBand'
import { refinePeak } from '../analysis/refinePeak'
import { windowBand } from '../analysis/windowBand'
import { typeAStandardUncertainty } from '../uncertainty/typeAStandardUncertainty'

export interface ClockOffset {
  /** Frequency of the reference tone as the input read it, Hz. */
  measuredHz: number
  /** (measured / reference − 1)·10⁶: positive when the tone read higher than the reference. */
  offsetPpm: number
  /** Standard uncertainty (k = 1) of the offset: the tone's spread over the recording and the reference's own. */
  uncertaintyPpm: number
}

export interface ClockOffsetOptions {
  /** The reference's own standard uncertainty, ppm (default 0). */
  referenceUncertaintyPpm?: number
  /** How far from the reference the tone is looked for, ppm (default 2000: a crystal far out of its rating). */
  searchPpm?: number
}

/** Shortest steady tone measured, s (after the first and last tenth are dropped). */
export const MIN_REFERENCE_TONE_S = 2
/** Pieces the steady span is cut into for the spread of the reading. */
const SEGMENTS = 8
/** Share of the span's power the tone must carry: a reference recording is the tone. */
const MIN_TONE_SHARE = 0.5

/**
 * The clock offset of a sound input from a recorded reference tone of known frequency. The
 * steady middle of the recording (its first and last tenth dropped) is read with a
 * Blackman–Harris window (Harris 1978): the DTFT is searched on a one-bin grid within
 * ±`searchPpm` of the reference, and its maximum refined by iterated parabolic
 * interpolation to a hundredth of a bin (refinePeak; the periodogram maximum is the
 * maximum-likelihood frequency of one sinusoid in white noise, Rife & Boorstyn 1974).
 * The uncertainty is Type A (JCGM 100:2008 §4.2): the spread of the same reading on eight
 * consecutive pieces of the span over √8 — larger than the whole window's scatter, but it
 * also holds any wander of the tone — combined with the reference's stated uncertainty.
 * Throws AnalysisError: 400 for a reference outside the band, 422 for a tone too short,
 * too weak or not found near the reference.
 */
export function measureClockOffset(samples: Float64Array, sampleRate: number, referenceHz: number, options: ClockOffsetOptions = {}): ClockOffset {
  const searchPpm = options.searchPpm ?? 2000
  const referenceUncertaintyPpm = options.referenceUncertaintyPpm ?? 0
  if (!(sampleRate > 0 && Number.isFinite(sampleRate))) throw new RangeError('measureClockOffset needs a positive sample rate')
  if (!(searchPpm > 0 && searchPpm <= 100_000)) throw new RangeError('measureClockOffset needs a search reach between 0 and 100 000 ppm')
  if (!(referenceHz > 0 && referenceHz * (1 + searchPpm * 1e-6) < sampleRate / 2)) {
    throw new AnalysisError(400, 'reference_out_of_band', `A reference tone of ${referenceHz} Hz cannot be recorded at ${sampleRate} Hz; choose a reference below ${Math.floor(sampleRate / 2.2)} Hz.`)
  }
  if (!(referenceUncertaintyPpm >= 0 && Number.isFinite(referenceUncertaintyPpm))) throw new AnalysisError(400, 'bad_reference_uncertainty', 'The reference uncertainty must be zero or more parts per million.')
  const start = Math.floor(samples.length / 10)
  const length = samples.length - 2 * start
  if (length < MIN_REFERENCE_TONE_S * sampleRate) {
    throw new AnalysisError(422, 'reference_too_short', `The reference tone must last at least ${Math.ceil(MIN_REFERENCE_TONE_S / 0.8)} s.`)
  }
  const band = inputBand(samples, sampleRate)
  const whole = windowBand(band, start, length)
  const binHz = sampleRate / length
  const reachHz = referenceHz * searchPpm * 1e-6
  const steps = Math.ceil(reachHz / binHz)
  const grid = Array.from({ length: 2 * steps + 1 }, (_, j) => referenceHz + (j - steps) * binHz)
  const power = basebandDtft(whole, grid).map(x => x.re * x.re + x.im * x.im)
  const best = power.indexOf(Math.max(...power))
  const peak = refinePeak(whole, grid[best]!, [1, 0.1, 0.01])
  if (Math.abs(peak.frequencyHz - referenceHz) > reachHz || !toneDominates(samples, start, length, peak.magnitude)) {
    throw new AnalysisError(422, 'reference_not_found', `The recording holds no steady tone within ${searchPpm} ppm of ${referenceHz} Hz strong enough to calibrate with.`)
  }
  const pieceLength = Math.floor(length / SEGMENTS)
  const readings: number[] = []
  for (let k = 0; k < SEGMENTS; k++) {
    readings.push(refinePeak(windowBand(band, start + k * pieceLength, pieceLength), peak.frequencyHz, [0.1, 0.01]).frequencyHz)
  }
  const spreadHz = typeAStandardUncertainty(readings) ?? 0
  return {
    measuredHz: peak.frequencyHz,
    offsetPpm: (peak.frequencyHz / referenceHz - 1) * 1e6,
    uncertaintyPpm: Math.hypot((spreadHz / referenceHz) * 1e6, referenceUncertaintyPpm),
  }
}

/** Whether a sinusoid of window magnitude |X| carries at least MIN_TONE_SHARE of the span's power (mean removed). */
function toneDominates(samples: Float64Array, start: number, length: number, magnitude: number): boolean {
  let sum = 0
  let squares = 0
  for (let j = start; j < start + length; j++) {
    sum += samples[j]!
    squares += samples[j]! * samples[j]!
  }
  const spanPower = squares / length - (sum / length) ** 2
  // A sinusoid of amplitude A gives |X| = A·a₀·N/2 under the window; its power is A²/2.
  const amplitude = (2 * magnitude) / (BLACKMAN_HARRIS_COEFFICIENTS[0] * length)
  return spanPower > 0 && (amplitude * amplitude) / 2 >= MIN_TONE_SHARE * spanPower
}
