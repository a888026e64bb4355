import { cachedBlackmanHarris } from './cachedBlackmanHarris'
import { windowedPowerSpectrum } from './windowedPowerSpectrum'
import { selectQuantile } from './selectQuantile'

/** Bins either side of the strongest whose median is the noise under it (a main lobe is ±4). */
const NEIGHBOURHOOD_BINS = 64

/**
 * How far the strongest line of `signal` (a power-of-two length ≥ 64) stands over the median of the
 * 129 bins around it, dB, in its Blackman–Harris windowed spectrum from 5 bins to 95 % of the band: a decaying partial
 * stands tens of dB over the noise between lines, while noise, even coloured, or a sparse
 * scatter of sample values, stands about 10 to 20 dB (the largest of n exponentially distributed
 * bin powers lies about ln n over their median; Kay, Fundamentals of Statistical Signal
 * Processing II, 1998, §9.5, the periodogram of noise).
 */
export function tonalityDb(signal: Float64Array): number {
  const size = signal.length
  if (size < 64 || (size & (size - 1)) !== 0) throw new RangeError('tonalityDb needs a power-of-two length of at least 64')
  // Clear of 0 Hz's main lobe (±4 bins), so a low partial counts (a timpani's 74 Hz).
  const power = windowedPowerSpectrum(signal, 0, cachedBlackmanHarris(size), size).subarray(5, Math.floor(0.95 * (size / 2)))
  let strongest = 0
  for (let k = 1; k < power.length; k++) if (power[k]! > power[strongest]!) strongest = k
  if (!(power[strongest]! > 0)) return 0
  // The median of the bins around it: coloured noise (a room's rumble) is level there, a line is not.
  const around = power.subarray(Math.max(0, strongest - NEIGHBOURHOOD_BINS), Math.min(power.length, strongest + NEIGHBOURHOOD_BINS + 1))
  const median = selectQuantile(around, 0.5)
  return 10 * Math.log10(power[strongest]! / Math.max(median, Number.MIN_VALUE))
}
