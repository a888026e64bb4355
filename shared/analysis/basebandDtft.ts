import type { Baseband } from './decimateBand'
import { dtftAt, type Complex } from './dtftAt'

/**
 * DTFT X(f) = Σ z[j]·r^j, r = e^{−2πi(f − centerHz) / rate}, of a complex baseband span at
 * each of `frequenciesHz` (input frequencies), phase referred to the span's first sample.
 * By Horner's rule from the last sample, X ← X·r + z[j]: a first-order complex recurrence
 * whose pole lies on the unit circle, so rounding grows only linearly with the length, and
 * it stays accurate next to 0 Hz, where a band's partials sit (the second-order Goertzel
 * recurrence does not). A real span (`real`) takes that Goertzel recurrence (dtftAt), a
 * third of the work, since its partials sit far from 0 Hz.
 */
export function basebandDtft(span: Baseband, frequenciesHz: readonly number[]): Complex[] {
  const { re, im, sampleRateHz, centerHz } = span
  if (!(sampleRateHz > 0) || re.length !== im.length) throw new RangeError('basebandDtft needs a span with a positive rate')
  if (span.real) return frequenciesHz.map(f => dtftAt(re, f - centerHz, sampleRateHz))
  return frequenciesHz.map((f) => {
    const omega = (-2 * Math.PI * (f - centerHz)) / sampleRateHz
    const rRe = Math.cos(omega)
    const rIm = Math.sin(omega)
    let sumRe = 0
    let sumIm = 0
    for (let j = re.length - 1; j >= 0; j--) {
      const next = sumRe * rRe - sumIm * rIm + re[j]!
      sumIm = sumRe * rIm + sumIm * rRe + im[j]!
      sumRe = next
    }
    return { re: sumRe, im: sumIm }
  })
}
