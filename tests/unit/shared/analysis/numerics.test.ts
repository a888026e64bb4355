import { describe, expect, it } from 'vitest'
import { blackmanHarris, directDft, dtftAt } from '../../../../shared/analysis/index'
import { basebandDtft } from '../../../../shared/analysis/basebandDtft'
import { seededRandom } from '../../../support/seededRandom'

// Mirrored tests of blackmanHarris, realFft, fitLine, selectQuantile, parabolicPeak and
// nextPowerOfTwo live in files named after them; the DTFT helpers are checked together here.
describe('DTFT', () => {
  it('dtftAt and basebandDtft agree with the DFT at bin frequencies', () => {
    const random = seededRandom(7)
    const n = 256
    const fs = 1000
    const x = new Float64Array(n).map(() => random.normal())
    const dft = directDft(x)
    for (const k of [0, 1, 17, 64, 127]) {
      const v = dtftAt(x, (k * fs) / n, fs)
      expect(v.re).toBeCloseTo(dft[2 * k]!, 9)
      expect(v.im).toBeCloseTo(dft[2 * k + 1]!, 9)
    }
    const [a, b, c] = basebandDtft({ re: x, im: new Float64Array(n), sampleRateHz: fs, centerHz: 0 }, [(5 * fs) / n, (9 * fs) / n, (33 * fs) / n])
    expect(a!.re).toBeCloseTo(dft[10]!, 9)
    expect(a!.im).toBeCloseTo(dft[11]!, 9)
    expect(b!.re).toBeCloseTo(dft[18]!, 9)
    expect(b!.im).toBeCloseTo(dft[19]!, 9)
    expect(c!.re).toBeCloseTo(dft[66]!, 9)
    expect(c!.im).toBeCloseTo(dft[67]!, 9)
  })

  it('basebandDtft matches a direct sum at odd and short lengths and off-bin frequencies', () => {
    // source: definition of the DTFT, |Σ x[n] e^{−iωn}|², summed directly here
    const random = seededRandom(11)
    const fs = 48000
    for (const n of [1, 2, 3, 255, 4801]) {
      const x = new Float64Array(n).map(() => random.normal())
      const frequencies = [0, 1234.567, 23999.9] as const
      const direct = frequencies.map((f) => {
        let re = 0
        let im = 0
        for (let i = 0; i < n; i++) {
          re += x[i]! * Math.cos((2 * Math.PI * f * i) / fs)
          im -= x[i]! * Math.sin((2 * Math.PI * f * i) / fs)
        }
        return re * re + im * im
      })
      const fast = basebandDtft({ re: x, im: new Float64Array(n), sampleRateHz: fs, centerHz: 0 }, frequencies).map(v => v.re * v.re + v.im * v.im)
      for (let k = 0; k < 3; k++) expect(Math.abs(fast[k]! - direct[k]!)).toBeLessThan(1e-9 * Math.max(1, direct[k]!))
    }
  })

  it('the DTFT of a windowed sinusoid peaks at amplitude × Σw / 2', () => {
    const n = 4800
    const fs = 48000
    const w = blackmanHarris(n)
    const x = new Float64Array(n)
    let sum = 0
    for (let i = 0; i < n; i++) {
      x[i] = 0.5 * Math.cos((2 * Math.PI * 1234.5 * i) / fs + 0.3) * w[i]!
      sum += w[i]!
    }
    const v = dtftAt(x, 1234.5, fs)
    expect(Math.hypot(v.re, v.im) / ((0.5 * sum) / 2)).toBeCloseTo(1, 6)
  })
})
