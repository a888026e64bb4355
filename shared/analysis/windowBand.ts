import { cachedBlackmanHarris } from './cachedBlackmanHarris'
import type { Baseband, DecimatedBand } from './decimateBand'

/**
 * The band's samples in the input span [startIndex, startIndex + length) times the periodic
 * 4-term Blackman–Harris window (Harris 1978) of that span, w(t) at each band sample's own
 * input time t: the long window of the refinement, taken at the band's rate. By the
 * sampling theorem (the windowed band is band-limited well within the band's rate) its DTFT
 * times the factor is the input's windowed DTFT over exactly that span. `startIndex` must be
 * one of the band's sample times (bandSource's `alignIndex`).
 */
export function windowBand(band: DecimatedBand, startIndex: number, length: number): Baseband {
  const { factor } = band
  const first = (startIndex - band.firstIndex) / factor
  const count = Math.min(Math.ceil(length / factor), band.re.length - first)
  if (!(Number.isInteger(first) && first >= 0 && count >= 1 && length >= 1)) throw new RangeError('windowBand needs a span inside the band that starts on one of its samples')
  const w = cachedBlackmanHarris(count, length / factor)
  const re = windowed(band.re, first, w, count)
  // A real band's zeros stay zeros: a view of them, read only like every windowed span.
  const im = band.real ? band.im.subarray(first, first + count) : windowed(band.im, first, w, count)
  return { re, im, sampleRateHz: band.sampleRateHz, centerHz: band.centerHz, durationS: (length / factor) / band.sampleRateHz, real: band.real }
}

/** x[first + j]·w[j] for j < count (a function of its own: the loop is compiled whole, not entered mid-way). */
function windowed(x: Float64Array, first: number, w: Float64Array, count: number): Float64Array {
  const out = new Float64Array(count)
  for (let j = 0; j < count; j++) out[j] = x[first + j]! * w[j]!
  return out
}
