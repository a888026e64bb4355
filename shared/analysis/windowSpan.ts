import { BLACKMAN_HARRIS_COEFFICIENTS } from './blackmanHarris'

/** A span multiplied by a Blackman–Harris window, with the window's gain for a decaying partial. */
export interface WindowedSpan {
  windowed: Float64Array
  /** Σ w[n] · e^{−α (n − n₀)}: the window's gain for a partial of decay α, referenced to n₀. */
  decayingGain: number
}

/**
 * `signal[start … start + length)` times a periodic 4-term Blackman–Harris window (Harris
 * 1978), and the gain Σ w[n]·e^{−α(start + n − referenceIndex)} of that window for a
 * partial decaying at `alphaPerSample` nepers per sample — in one pass and without
 * storing the window, since long spans are windowed once per partial. `out` (at least
 * `length` long), when given, receives the windowed span instead of a new array.
 */
export function windowSpan(
  signal: Float64Array,
  start: number,
  length: number,
  alphaPerSample: number,
  referenceIndex: number,
  out?: Float64Array,
): WindowedSpan {
  const [a0, a1, a2, a3] = BLACKMAN_HARRIS_COEFFICIENTS
  const windowed = out && out.length >= length ? out.subarray(0, length) : new Float64Array(length)
  const step = (2 * Math.PI) / length
  const cosStep = Math.cos(step)
  const sinStep = Math.sin(step)
  const perSample = Math.exp(-alphaPerSample)
  let envelope = Math.exp(-alphaPerSample * (start - referenceIndex))
  let gain = 0
  let c = 1
  let s = 0
  for (let n = 0; n < length; n++) {
    if ((n & 1023) === 0) {
      c = Math.cos(step * n)
      s = Math.sin(step * n)
    }
    const w = a0 - a1 * c + a2 * (2 * c * c - 1) - a3 * c * (4 * c * c - 3)
    windowed[n] = signal[start + n]! * w
    gain += w * envelope
    envelope *= perSample
    const next = c * cosStep - s * sinStep
    s = s * cosStep + c * sinStep
    c = next
  }
  return { windowed, decayingGain: gain }
}
