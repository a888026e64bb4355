import { besselI0 } from './besselI0'
import { phasorTable } from './phasorTable'

/** Design of a linear-phase low-pass FIR filter. */
export interface LowPassDesign {
  /** Stopband attenuation in dB (default 60). */
  attenuationDb?: number
}

/**
 * Taps of a linear-phase low-pass FIR filter by the window method with a Kaiser window
 * (Kaiser 1974; design formulas in Oppenheim & Schafer, Discrete-Time Signal Processing,
 * 3rd ed., §7.6.1): β from the attenuation A, length M + 1 with
 * M = ⌈(A − 8) / (2.285 · 2π Δf)⌉ (made even, so the delay M/2 is a whole sample).
 * `cutoffCycles` is the −6 dB point and `transitionCycles` the full transition width,
 * both in cycles per sample. The taps are scaled to unit gain at 0 Hz.
 */
export function kaiserLowPass(cutoffCycles: number, transitionCycles: number, design: LowPassDesign = {}): Float64Array {
  const attenuationDb = design.attenuationDb ?? 60
  if (!(cutoffCycles > 0 && cutoffCycles < 0.5)) throw new RangeError('kaiserLowPass needs a cutoff between 0 and half a cycle per sample')
  if (!(transitionCycles > 0 && transitionCycles < 0.5)) throw new RangeError('kaiserLowPass needs a transition width between 0 and half a cycle per sample')
  if (!(attenuationDb >= 21 && attenuationDb <= 150)) throw new RangeError('kaiserLowPass needs an attenuation between 21 and 150 dB')
  const beta = attenuationDb > 50
    ? 0.1102 * (attenuationDb - 8.7)
    : 0.5842 * (attenuationDb - 21) ** 0.4 + 0.07886 * (attenuationDb - 21)
  let order = Math.ceil((attenuationDb - 8) / (2.285 * 2 * Math.PI * transitionCycles))
  if (order % 2 === 1) order++
  const half = order / 2
  const taps = new Float64Array(order + 1)
  const norm = besselI0(beta)
  // Symmetric: compute one half; sin(2π f k) by a rotation recurrence.
  const { sin } = phasorTable(2 * Math.PI * cutoffCycles, half + 1)
  let sum = 0
  for (let k = 0; k <= half; k++) {
    const r = k / half
    const window = besselI0(beta * Math.sqrt(Math.max(0, 1 - r * r))) / norm
    const sinc = k === 0 ? 2 * cutoffCycles : sin[k]! / (Math.PI * k)
    const value = window * sinc
    taps[half + k] = value
    taps[half - k] = value
    sum += k === 0 ? value : 2 * value
  }
  for (let n = 0; n <= order; n++) taps[n]! /= sum
  return taps
}
