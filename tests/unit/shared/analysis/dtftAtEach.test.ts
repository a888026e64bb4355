import { describe, expect, it } from 'vitest'
import { dtftAt } from '../../../../shared/analysis/dtftAt'
import { dtftAtEach } from '../../../../shared/analysis/dtftAtEach'
import { seededRandom } from '../../../support/seededRandom'

describe('dtftAtEach', () => {
  it('gives bit for bit what dtftAt gives at each frequency, for groups of one to seven', () => {
    const random = seededRandom(3)
    const signal = new Float64Array(1000).map(() => random.normal())
    for (let count = 1; count <= 7; count++) {
      const frequenciesHz = Array.from({ length: count }, (_, k) => 37.5 + 11.25 * k)
      const each = dtftAtEach(signal, frequenciesHz, 8000)
      expect(each).toHaveLength(count)
      each.forEach((x, k) => expect(x).toStrictEqual(dtftAt(signal, frequenciesHz[k]!, 8000)))
    }
  })

  it('reads a cosine over whole periods at A·N/2 with its phase, and nothing at another bin', () => {
    const n = 800
    const signal = new Float64Array(n).map((_, i) => 0.5 * Math.cos((2 * Math.PI * 25 * i) / n + 0.3))
    const [on, off] = dtftAtEach(signal, [25, 40], n)
    // source: DFT of a sinusoid on bin k of an N-point frame, X[k] = (A·N/2)·e^{iφ}, X[m ≠ ±k] = 0
    expect(Math.hypot(on!.re, on!.im)).toBeCloseTo(0.25 * n, 6)
    expect(Math.atan2(on!.im, on!.re)).toBeCloseTo(0.3, 9)
    expect(Math.hypot(off!.re, off!.im)).toBeLessThan(1e-8)
  })

  it('refuses a sample rate that is not positive and gives nothing for no frequencies', () => {
    expect(() => dtftAtEach(new Float64Array(4), [1], 0)).toThrow(RangeError)
    expect(dtftAtEach(new Float64Array(4), [], 8000)).toEqual([])
  })
})
