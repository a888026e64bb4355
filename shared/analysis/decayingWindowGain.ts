import { BLACKMAN_HARRIS_COEFFICIENTS } from './blackmanHarris'

/**
 * Σ_{n<N} w[n]·e^{−α(n + offset)} for the periodic 4-term Blackman–Harris window w of
 * length N (Harris 1978): the window's gain for a partial decaying at α nepers per sample,
 * referenced `offset` samples before the window starts. In closed form, since w is a sum
 * of cosines c_k·cos(2πkn/N) and each term is a geometric series,
 * Σ e^{(−α + iθ)n} = (1 − e^{(−α + iθ)N}) / (1 − e^{−α + iθ}) — O(1) instead of O(N).
 */
export function decayingWindowGain(length: number, alphaPerSample: number, offset: number): number {
  if (!(length >= 1)) throw new RangeError('decayingWindowGain needs a positive length')
  const [a0, a1, a2, a3] = BLACKMAN_HARRIS_COEFFICIENTS
  const signs = [a0, -a1, a2, -a3]
  const decayN = Math.exp(-alphaPerSample * length)
  let sum = 0
  for (let k = 0; k < 4; k++) {
    const theta = (2 * Math.PI * k) / length
    let term: number
    if (Math.abs(alphaPerSample) < 1e-12 && k === 0) term = length
    else if (Math.abs(alphaPerSample) < 1e-12) term = 0 // a whole number of cycles sums to zero
    else {
      // Re[(1 − e^{−αN}e^{iθN}) / (1 − e^{−α}e^{iθ})], with e^{iθN} = 1 for θ = 2πk/N.
      const r = Math.exp(-alphaPerSample)
      const denRe = 1 - r * Math.cos(theta)
      const denIm = -r * Math.sin(theta)
      const num = 1 - decayN
      term = (num * denRe) / (denRe * denRe + denIm * denIm)
    }
    sum += signs[k]! * term
  }
  return sum * Math.exp(-alphaPerSample * offset)
}
