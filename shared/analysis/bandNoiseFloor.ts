import { selectQuantile } from './selectQuantile'

/** Work space of the quantile, shared by every call (it is called for every frame of every band). */
const scratch = new Float64Array(128)
const sample = new Float64Array(128)

/**
 * Noise floor of a power spectrum, bin by bin, as the lower quartile of the power in
 * bands half an octave wide (never narrower than `minBandBins`). Banded, because the
 * noise of a workshop is far from white (hum, rumble, fans); the lower quartile,
 * because a band may be partly covered by the main lobes of partials and the quartile
 * ignores up to three quarters of its bins. Writes `floor[kMin…kMax]` and returns it.
 */
export function bandNoiseFloor(
  power: Float64Array,
  kMin: number,
  kMax: number,
  minBandBins: number,
  floor: Float64Array = new Float64Array(power.length),
): Float64Array {
  let lo = kMin
  while (lo <= kMax) {
    let hi = Math.max(lo + minBandBins - 1, Math.floor(lo * Math.SQRT2))
    // Do not leave a sliver of a band at the top.
    if (kMax - hi < minBandBins / 2) hi = kMax
    hi = Math.min(hi, kMax)
    const width = hi - lo + 1
    const stride = Math.max(1, Math.ceil(width / 128))
    let count = 0
    for (let k = lo; k <= hi; k += stride) sample[count++] = power[k]!
    const level = selectQuantile(sample.subarray(0, count), 0.25, scratch)
    floor.fill(level, lo, hi + 1)
    lo = hi + 1
  }
  return floor
}
