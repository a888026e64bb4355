import type { DecimatedBand } from './decimateBand'

/**
 * The input signal itself in the form of a decimated band (factor 1, centre 0 Hz, real):
 * what a track is read from where no decimated band pays for itself, and what a window over
 * the input at its own rate is cut from (windowBand).
 */
export function inputBand(signal: Float64Array, sampleRate: number): DecimatedBand {
  if (!(sampleRate > 0)) throw new RangeError('inputBand needs a positive sample rate')
  return { re: signal, im: new Float64Array(signal.length), sampleRateHz: sampleRate, centerHz: 0, factor: 1, firstIndex: 0, real: true }
}
