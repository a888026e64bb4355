import { realFft } from './realFft'

/**
 * |X[k]|² for k = 0 … fftSize / 2 of `signal[startIndex … startIndex + window.length)` times
 * `window`, zero-padded to `fftSize` (a power of two, realFft): the power spectrum of one
 * windowed stretch, which the rough look, the long look and the tonality check each read.
 */
export function windowedPowerSpectrum(signal: Float64Array, startIndex: number, window: Float64Array, fftSize: number): Float64Array {
  const length = window.length
  if (!(fftSize >= length && startIndex >= 0 && startIndex + length <= signal.length)) {
    throw new RangeError('windowedPowerSpectrum needs a stretch inside the signal and a transform that holds it')
  }
  const buffer = new Float64Array(fftSize)
  for (let i = 0; i < length; i++) buffer[i] = signal[startIndex + i]! * window[i]!
  const spectrum = realFft(buffer)
  const power = new Float64Array(fftSize / 2 + 1)
  for (let k = 0; k <= fftSize / 2; k++) power[k] = spectrum[2 * k]! ** 2 + spectrum[2 * k + 1]! ** 2
  return power
}
