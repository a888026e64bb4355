/**
 * Coefficients of the minimum 4-term Blackman–Harris window, Harris (1978),
 * Proc. IEEE 66(1) 51–83: highest sidelobe −92 dB, main lobe ±4 bins.
 *
 * Why this window: the partials of a struck piece span 60 dB or more, so a weak
 * upper partial must not drown in the sidelobes of the fundamental; −92 dB keeps
 * leakage under 16-bit quantisation noise, at the cost of a wide main lobe, which the
 * window length (see chooseWindow) pays for.
 */
export const BLACKMAN_HARRIS_COEFFICIENTS = [0.35875, 0.48829, 0.14128, 0.01168] as const

/**
 * Periodic ("DFT-even") 4-term Blackman–Harris window of `length` samples
 * (Harris 1978, eq. for the minimum 4-term window). Periodic form, because it is used
 * for spectral analysis, where it gives the exact lobe shape Harris tabulates.
 * `period` (default `length`) is the window's span in samples, which need not be whole:
 * w[n] = w(n / period), for a window taken at a decimated rate.
 */
export function blackmanHarris(length: number, period = length): Float64Array {
  if (!Number.isInteger(length) || length < 1) throw new RangeError('window length must be a positive integer')
  if (!(period > 0)) throw new RangeError('window period must be positive')
  const [a0, a1, a2, a3] = BLACKMAN_HARRIS_COEFFICIENTS
  const w = new Float64Array(length)
  const step = (2 * Math.PI) / period
  const cosStep = Math.cos(step)
  const sinStep = Math.sin(step)
  let c = 1
  let sn = 0
  for (let n = 0; n < length; n++) {
    // cos(n·step) by rotating a phasor (re-seeded exactly every 1024 samples so rounding
    // cannot build up); cos 2x and cos 3x from cos x (Chebyshev polynomials). Math.cos
    // per sample costs more than the rest of a long-window refinement.
    if ((n & 1023) === 0) {
      c = Math.cos(step * n)
      sn = Math.sin(step * n)
    }
    w[n] = a0 - a1 * c + a2 * (2 * c * c - 1) - a3 * c * (4 * c * c - 3)
    const next = c * cosStep - sn * sinStep
    sn = sn * cosStep + c * sinStep
    c = next
  }
  return w
}
