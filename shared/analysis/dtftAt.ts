import { finishGoertzel } from './finishGoertzel'

/** A complex value. */
export interface Complex {
  re: number
  im: number
}

/**
 * Discrete-time Fourier transform X(f) = Σ x[n] e^{−2πi f n / fs} of a real signal at
 * one arbitrary frequency `frequencyHz`, by the Goertzel recurrence (Goertzel 1958):
 * one multiply and two adds per sample, so a peak can be evaluated off the FFT grid
 * over a long span for the price of a fraction of an FFT.
 */
export function dtftAt(signal: Float64Array, frequencyHz: number, sampleRate: number): Complex {
  const n = signal.length
  const omega = (2 * Math.PI * frequencyHz) / sampleRate
  const coeff = 2 * Math.cos(omega)
  let s1 = 0
  let s2 = 0
  for (let i = 0; i < n; i++) {
    const s0 = signal[i]! + coeff * s1 - s2
    s2 = s1
    s1 = s0
  }
  return finishGoertzel(s1, s2, omega, n)
}
