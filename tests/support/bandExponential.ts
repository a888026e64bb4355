import type { BandSignal } from '../../shared/analysis/mixDownBand'

/** A damped cosine A·e^{−δn}·cos(ωn + φ) as a down-mix sees it: ω − ω_c is `offsetRad` per input sample. */
export interface DampedTone {
  amplitude: number
  damping: number
  phase: number
  offsetRad: number
}

/**
 * Where output `m` of a down-mix of `tone` must lie: (A/2)·e^{iφ}·H(u)·u^t at the output's input
 * time t = firstIndex + m·factor, with u = e^{−δ + i(ω − ω_c)} per input sample and
 * H(u) = Σ_j h[j]·u^{(j − c)·tapStep} over the taps (an identity of linear filtering: a damped
 * exponential through a linear filter is the same exponential times the filter's gain at its pole).
 * `magnitude` is |(A/2)·u^t|, the scale an error is judged against.
 */
export function bandExponentialAt(band: BandSignal, m: number, tone: DampedTone): { re: number, im: number, magnitude: number } {
  const delay = (band.taps.length - 1) / 2
  let hRe = 0
  let hIm = 0
  for (let j = 0; j < band.taps.length; j++) {
    const lag = (j - delay) * band.tapStep
    const g = band.taps[j]! * Math.exp(-tone.damping * lag)
    hRe += g * Math.cos(tone.offsetRad * lag)
    hIm += g * Math.sin(tone.offsetRad * lag)
  }
  const t = band.firstIndex + m * band.factor
  const magnitude = (tone.amplitude / 2) * Math.exp(-tone.damping * t)
  const angle = tone.phase + tone.offsetRad * t
  return {
    re: magnitude * (Math.cos(angle) * hRe - Math.sin(angle) * hIm),
    im: magnitude * (Math.cos(angle) * hIm + Math.sin(angle) * hRe),
    magnitude,
  }
}
