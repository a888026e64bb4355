import { basebandDtft } from './basebandDtft'
import type { Baseband } from './decimateBand'

/** A peak located precisely on one long window. */
export interface RefinedPeak {
  frequencyHz: number
  /** |X(f)| at the peak (the vertex of the last parabola). */
  magnitude: number
}

/**
 * Maximum of the DTFT magnitude of an already windowed (baseband) span near `frequencyHz`, by
 * iterated parabolic interpolation of the dB magnitude at f − δ, f, f + δ with shrinking
 * δ (`stepsBins`, in bins of the span, fs / N). The magnitude of a real, smooth window's
 * lobe is symmetric about the true frequency even when the partial decays within the
 * span, so the iteration converges on the partial's frequency with no window bias.
 * Near the top the lobe is so close to a parabola in dB that a step of 0.1 bin leaves
 * an error far under 0.001 bin; the default steps are one bin, then a tenth.
 */
export function refinePeak(
  windowed: Baseband,
  frequencyHz: number,
  stepsBins: readonly number[] = [1, 0.1],
): RefinedPeak {
  const binHz = 1 / (windowed.durationS ?? windowed.re.length / windowed.sampleRateHz)
  let f = frequencyHz
  let peakDb = -Infinity
  for (const step of stepsBins) {
    const delta = step * binHz
    const [pl, pc, pr] = basebandDtft(windowed, [f - delta, f, f + delta]).map(x => x.re * x.re + x.im * x.im) as [number, number, number]
    const left = 10 * Math.log10(pl + Number.MIN_VALUE)
    const centre = 10 * Math.log10(pc + Number.MIN_VALUE)
    const right = 10 * Math.log10(pr + Number.MIN_VALUE)
    const denominator = left - 2 * centre + right
    let offset = denominator < 0 ? (0.5 * (left - right)) / denominator : 0
    // Off the top of the lobe the parabola is unreliable: walk at most one step uphill.
    if (!(Math.abs(offset) <= 1)) offset = left > right ? -1 : 1
    f += offset * delta
    peakDb = centre - 0.25 * (left - right) * offset
  }
  return { frequencyHz: f, magnitude: 10 ** (peakDb / 20) }
}
