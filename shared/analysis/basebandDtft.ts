import type { Baseband } from './decimateBand'
import type { Complex } from './dtftAt'
import { dtftAtEach } from './dtftAtEach'

/**
 * DTFT X(f) = Σ z[j]·r^j, r = e^{−2πi(f − centerHz) / rate}, of a complex baseband span at
 * each of `frequenciesHz` (input frequencies), phase referred to the span's first sample.
 * By Horner's rule from the last sample, X ← X·r + z[j]: a first-order complex recurrence
 * whose pole lies on the unit circle, so rounding grows only linearly with the length, and
 * it stays accurate next to 0 Hz, where a band's partials sit (the second-order Goertzel
 * recurrence does not). A real span (`real`) takes that Goertzel recurrence (dtftAt), a
 * third of the work, since its partials sit far from 0 Hz (dtftAtEach).
 */
export function basebandDtft(span: Baseband, frequenciesHz: readonly number[]): Complex[] {
  const { re, im, sampleRateHz, centerHz } = span
  if (!(sampleRateHz > 0) || re.length !== im.length) throw new RangeError('basebandDtft needs a span with a positive rate')
  if (span.real) return dtftAtEach(re, frequenciesHz.map(f => f - centerHz), sampleRateHz)
  const out: Complex[] = []
  // Three recurrences at a time in one pass: each waits on its own last step, so interleaved
  // they cost about what one does. A short last group repeats its last frequency (dropped).
  const sums = new Float64Array(6)
  const last = frequenciesHz.length - 1
  for (let first = 0; first <= last; first += 3) {
    const omegaA = (-2 * Math.PI * (frequenciesHz[first]! - centerHz)) / sampleRateHz
    const omegaB = (-2 * Math.PI * (frequenciesHz[Math.min(first + 1, last)]! - centerHz)) / sampleRateHz
    const omegaC = (-2 * Math.PI * (frequenciesHz[Math.min(first + 2, last)]! - centerHz)) / sampleRateHz
    hornerThree(re, im, omegaA, omegaB, omegaC, sums)
    for (let k = 0; k < 3 && first + k <= last; k++) out.push({ re: sums[2 * k]!, im: sums[2 * k + 1]! })
  }
  return out
}

/** Σ z[j]·r^j for r = e^{iω} at three ω by Horner's rule, from the last sample; re, im pairs into `sums`. */
function hornerThree(re: Float64Array, im: Float64Array, omegaA: number, omegaB: number, omegaC: number, sums: Float64Array): void {
  const aRe = Math.cos(omegaA)
  const aIm = Math.sin(omegaA)
  const bRe = Math.cos(omegaB)
  const bIm = Math.sin(omegaB)
  const cRe = Math.cos(omegaC)
  const cIm = Math.sin(omegaC)
  let aSumRe = 0
  let aSumIm = 0
  let bSumRe = 0
  let bSumIm = 0
  let cSumRe = 0
  let cSumIm = 0
  for (let j = re.length - 1; j >= 0; j--) {
    const x = re[j]!
    const y = im[j]!
    const aNext = aSumRe * aRe - aSumIm * aIm + x
    aSumIm = aSumRe * aIm + aSumIm * aRe + y
    aSumRe = aNext
    const bNext = bSumRe * bRe - bSumIm * bIm + x
    bSumIm = bSumRe * bIm + bSumIm * bRe + y
    bSumRe = bNext
    const cNext = cSumRe * cRe - cSumIm * cIm + x
    cSumIm = cSumRe * cIm + cSumIm * cRe + y
    cSumRe = cNext
  }
  sums[0] = aSumRe
  sums[1] = aSumIm
  sums[2] = bSumRe
  sums[3] = bSumIm
  sums[4] = cSumRe
  sums[5] = cSumIm
}
