import { describe, expect, it } from 'vitest'
import { blackmanHarris, directDft, dtftAt, windowSpan } from '../../../../shared/analysis/index'
import { dtftPowers3 } from '../../../../shared/analysis/dtftPowers3'
import { seededRandom } from '../../../support/seededRandom'

// Mirrored tests of blackmanHarris, realFft, fitLine, selectQuantile, parabolicPeak and
// nextPowerOfTwo live in files named after them; these stay here while windowSpan and the
// DTFT helpers are being rewritten.
describe('windowSpan', () => {
  it('windowSpan applies the same window and sums its decaying gain', () => {
    const random = seededRandom(4)
    const signal = new Float64Array(5000).map(() => random.normal())
    const length = 3001
    const w = blackmanHarris(length)
    const alpha = 2e-4
    const { windowed, decayingGain } = windowSpan(signal, 1000, length, alpha, 400)
    let gain = 0
    for (let n = 0; n < length; n++) {
      expect(windowed[n]).toBeCloseTo(signal[1000 + n]! * w[n]!, 12)
      gain += w[n]! * Math.exp(-alpha * (1000 + n - 400))
    }
    expect(decayingGain / gain).toBeCloseTo(1, 10)
  })
})

describe('DTFT', () => {
  it('dtftAt and dtftPowers3 agree with the DFT at bin frequencies', () => {
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
    const [a, b, c] = dtftPowers3(x, (5 * fs) / n, (9 * fs) / n, (33 * fs) / n, fs)
    expect(a).toBeCloseTo(dft[10]! ** 2 + dft[11]! ** 2, 8)
    expect(b).toBeCloseTo(dft[18]! ** 2 + dft[19]! ** 2, 8)
    expect(c).toBeCloseTo(dft[66]! ** 2 + dft[67]! ** 2, 8)
  })

  it('dtftPowers3 (two halves joined) matches a direct sum at odd and short lengths and off-bin frequencies', () => {
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
      const fast = dtftPowers3(x, frequencies[0], frequencies[1], frequencies[2], fs)
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
