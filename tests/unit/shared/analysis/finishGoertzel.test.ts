import { describe, expect, it } from 'vitest'
import { finishGoertzel } from '../../../../shared/analysis/finishGoertzel'
import { seededRandom } from '../../../support/seededRandom'

/** Goertzel (1958): s[n] = x[n] + 2cos ω·s[n−1] − s[n−2]; returns the last two states. */
function goertzelStates(x: Float64Array, omega: number): [number, number] {
  let s1 = 0
  let s2 = 0
  const coeff = 2 * Math.cos(omega)
  for (const v of x) {
    const s = v + coeff * s1 - s2
    s2 = s1
    s1 = s
  }
  return [s1, s2]
}

describe('finishGoertzel', () => {
  it('turns the recurrence\'s states into the DTFT Σ x[n] e^{−iωn}', () => {
    const random = seededRandom(19)
    for (const n of [1, 2, 17, 1000]) {
      const x = Float64Array.from({ length: n }, () => random.normal())
      for (const omega of [0.01, 0.7, 2.9]) {
        // source: DTFT definition, X(ω) = Σ x[n] e^{−iωn}, summed directly
        let re = 0
        let im = 0
        for (let k = 0; k < n; k++) {
          re += x[k]! * Math.cos(omega * k)
          im -= x[k]! * Math.sin(omega * k)
        }
        const [s1, s2] = goertzelStates(x, omega)
        const v = finishGoertzel(s1, s2, omega, n)
        expect(v.re).toBeCloseTo(re, 9)
        expect(v.im).toBeCloseTo(im, 9)
      }
    }
  })

  it('gives N·A/2 with the sinusoid\'s phase for a cosine on a bin', () => {
    const n = 64
    const omega = (2 * Math.PI * 5) / n
    const x = Float64Array.from({ length: n }, (_, k) => 0.8 * Math.cos(omega * k + 0.6))
    const [s1, s2] = goertzelStates(x, omega)
    const v = finishGoertzel(s1, s2, omega, n)
    // source: DFT of A·cos(ωn + φ) at its own bin is (N·A/2)·e^{iφ}
    expect(Math.hypot(v.re, v.im)).toBeCloseTo((n * 0.8) / 2, 9)
    expect(Math.atan2(v.im, v.re)).toBeCloseTo(0.6, 9)
  })
})
