import { basebandDtft } from './basebandDtft'
import type { Baseband } from './decimateBand'

/**
 * |X(f)|² in dB of an already windowed (baseband) span at `centreHz + j·gridHz`,
 * j = −count…count, computed cheaply: the span is mixed down to `centreHz` and summed in
 * blocks (a boxcar low-pass and decimation to about 8 × `halfWidthHz` samples per second),
 * the short sequence's DTFT is evaluated on the grid (basebandDtft), and the boxcar's
 * droop |sin(πνB/fs) / (B sin(πν/fs))| is divided out. Equal to the direct DTFT up to the
 * boxcar's aliasing, which is negligible within ±halfWidthHz.
 */
export function basebandLevels(windowed: Baseband, centreHz: number, halfWidthHz: number, gridHz: number): Float64Array {
  if (!(halfWidthHz > 0) || !(gridHz > 0)) throw new RangeError('basebandLevels needs a positive width and grid')
  const { re: xRe, im: xIm, sampleRateHz: sampleRate } = windowed
  const n = xRe.length
  const block = Math.max(1, Math.floor(sampleRate / (8 * halfWidthHz)))
  const count = Math.floor(n / block)
  const re = new Float64Array(count)
  const im = new Float64Array(count)
  mixBlocks(xRe, xIm, (-2 * Math.PI * (centreHz - windowed.centerHz)) / sampleRate, block, re, im)
  const points = Math.ceil(halfWidthHz / gridHz)
  const offsetsHz = Array.from({ length: 2 * points + 1 }, (_, i) => (i - points) * gridHz)
  const values = basebandDtft({ re, im, sampleRateHz: sampleRate / block, centerHz: 0 }, offsetsHz)
  const levels = new Float64Array(2 * points + 1)
  for (let i = 0; i < levels.length; i++) {
    const x = (Math.PI * offsetsHz[i]!) / sampleRate
    const droop = x === 0 ? 1 : Math.abs(Math.sin(block * x) / (block * Math.sin(x)))
    levels[i] = 10 * Math.log10((values[i]!.re ** 2 + values[i]!.im ** 2) / (droop * droop) + 1e-300)
  }
  return levels
}

/**
 * Sums of `block` samples each turned by e^{i·step·n} (n the sample's index), one per slot of
 * `re`/`im`. A function of its own so the loop is compiled whole, not entered mid-way.
 */
function mixBlocks(xRe: Float64Array, xIm: Float64Array, step: number, block: number, re: Float64Array, im: Float64Array): void {
  const cs = Math.cos(step)
  const sn = Math.sin(step)
  for (let b = 0; b < re.length; b++) {
    // Re-seeded every block so rounding cannot build up.
    let c = Math.cos(step * b * block)
    let s = Math.sin(step * b * block)
    let sr = 0
    let si = 0
    for (let i = b * block; i < (b + 1) * block; i++) {
      const x = xRe[i]!
      const y = xIm[i]!
      sr += x * c - y * s
      si += x * s + y * c
      const next = c * cs - s * sn
      s = s * cs + c * sn
      c = next
    }
    re[b] = sr
    im[b] = si
  }
}
