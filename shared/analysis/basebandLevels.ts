/**
 * |X(f)|² in dB of an already windowed span at `centreHz + j·gridHz`, j = −count…count,
 * computed cheaply: the span is mixed down by `centreHz` and summed in blocks (a boxcar
 * low-pass and decimation to about 8 × `halfWidthHz` samples per second), the short
 * sequence's DTFT is evaluated on the grid by phasor rotation, and the boxcar's droop
 * |sin(πνB/fs) / (B sin(πν/fs))| is divided out. Equal to the direct DTFT up to the
 * boxcar's aliasing, which is negligible within ±halfWidthHz.
 */
export function basebandLevels(windowed: Float64Array, sampleRate: number, centreHz: number, halfWidthHz: number, gridHz: number): Float64Array {
  if (!(halfWidthHz > 0) || !(gridHz > 0)) throw new RangeError('basebandLevels needs a positive width and grid')
  const n = windowed.length
  const block = Math.max(1, Math.floor(sampleRate / (8 * halfWidthHz)))
  const count = Math.floor(n / block)
  const re = new Float64Array(count)
  const im = new Float64Array(count)
  const step = (-2 * Math.PI * centreHz) / sampleRate
  const cs = Math.cos(step)
  const sn = Math.sin(step)
  for (let b = 0; b < count; b++) {
    // Re-seeded every block so rounding cannot build up.
    let c = Math.cos(step * b * block)
    let s = Math.sin(step * b * block)
    let sr = 0
    let si = 0
    for (let i = b * block; i < (b + 1) * block; i++) {
      const x = windowed[i]!
      sr += x * c
      si += x * s
      const next = c * cs - s * sn
      s = s * cs + c * sn
      c = next
    }
    re[b] = sr
    im[b] = si
  }
  const points = Math.ceil(halfWidthHz / gridHz)
  const levels = new Float64Array(2 * points + 1)
  const blockS = block / sampleRate
  for (let j = -points; j <= points; j++) {
    const nu = j * gridHz
    const w = -2 * Math.PI * nu * blockS
    const cw = Math.cos(w)
    const sw = Math.sin(w)
    let c = 1
    let s = 0
    let sr = 0
    let si = 0
    for (let b = 0; b < count; b++) {
      sr += re[b]! * c - im[b]! * s
      si += re[b]! * s + im[b]! * c
      const next = c * cw - s * sw
      s = s * cw + c * sw
      c = next
    }
    const x = (Math.PI * nu) / sampleRate
    const droop = x === 0 ? 1 : Math.abs(Math.sin(block * x) / (block * Math.sin(x)))
    levels[j + points] = 10 * Math.log10((sr * sr + si * si) / (droop * droop) + 1e-300)
  }
  return levels
}
