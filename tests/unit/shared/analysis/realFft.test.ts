import FFT from 'fft.js'
import { describe, expect, it } from 'vitest'
import { directDft } from '../../../../shared/analysis/directDft'
import { fftPlan, realFft } from '../../../../shared/analysis/realFft'
import { seededRandom } from '../../../support/seededRandom'

/** How many entries differ in any bit (a deep equality of long arrays is slow in the test runner). */
function differing(a: Float64Array, b: Float64Array): number {
  let count = Math.abs(a.length - b.length)
  for (let i = 0; i < Math.min(a.length, b.length); i++) if (!Object.is(a[i], b[i])) count++
  return count
}

describe('realFft', () => {
  it('equals a direct DFT on random input to 1e-9 relative', () => {
    const random = seededRandom(42)
    for (const n of [8, 64, 512, 1024]) {
      const x = new Float64Array(n).map(() => random.normal())
      const fast = realFft(x)
      const slow = directDft(x)
      let maxError = 0
      let maxValue = 0
      for (let k = 0; k <= n / 2; k++) {
        maxError = Math.max(maxError, Math.hypot(fast[2 * k]! - slow[2 * k]!, fast[2 * k + 1]! - slow[2 * k + 1]!))
        maxValue = Math.max(maxValue, Math.hypot(slow[2 * k]!, slow[2 * k + 1]!))
      }
      expect(maxError / maxValue).toBeLessThan(1e-9)
    }
  })

  it('keeps the energy (Parseval) and reuses a buffer passed as out', () => {
    const random = seededRandom(5)
    const n = 256
    const x = new Float64Array(n).map(() => random.normal())
    const out = new Float64Array(2 * n)
    const spectrum = realFft(x, out)
    expect(spectrum).toBe(out)
    let timeEnergy = 0
    for (const v of x) timeEnergy += v * v
    // source: Parseval's theorem for the DFT, Σ|x|² = (1/N) Σ_k |X[k]|², with X[N−k] = conj X[k] for real x
    let binEnergy = spectrum[0]! ** 2 + spectrum[n]! ** 2 + spectrum[n + 1]! ** 2
    for (let k = 1; k < n / 2; k++) binEnergy += 2 * (spectrum[2 * k]! ** 2 + spectrum[2 * k + 1]! ** 2)
    expect(binEnergy / n / timeEnergy).toBeCloseTo(1, 10)
  })

  it('plans transform bit for bit as plans fft.js builds itself, forward and inverse', () => {
    const random = seededRandom(11)
    // Largest first: the smaller plans then take their twiddles from its table.
    for (let power = 14; power >= 1; power--) {
      const n = 2 ** power
      const x = new Float64Array(n).map(() => random.normal())
      const reference = new FFT(n)
      const expected = new Float64Array(2 * n)
      const actual = new Float64Array(2 * n)
      reference.realTransform(expected, x)
      fftPlan(n).realTransform(actual, x)
      expect(differing(actual, expected)).toBe(0)
      const back = new Float64Array(2 * n)
      const backExpected = new Float64Array(2 * n)
      reference.inverseTransform(backExpected, expected)
      fftPlan(n).inverseTransform(back, expected)
      expect(differing(back, backExpected)).toBe(0)
    }
  })

  it('gives fft.js\'s own real transform for every size from 2 to 2¹⁶, bins 0…N/2, to 1e-14 of the largest', () => {
    const random = seededRandom(23)
    for (let power = 1; power <= 16; power++) {
      const n = 2 ** power
      const x = new Float64Array(n).map(() => random.normal())
      // source: fft.js 4.0.4 (a general-purpose reference library), its radix-4 real transform
      const expected = new Float64Array(2 * n)
      new FFT(n).realTransform(expected, x)
      const actual = realFft(x)
      let maxError = 0
      let maxValue = 0
      for (let i = 0; i <= n + 1; i++) {
        maxError = Math.max(maxError, Math.abs(actual[i]! - expected[i]!))
        maxValue = Math.max(maxValue, Math.abs(expected[i]!))
      }
      expect(maxError / maxValue).toBeLessThan(1e-14)
    }
  })

  it('refuses lengths that are not powers of two', () => {
    expect(() => realFft(new Float64Array(100))).toThrow(RangeError)
    expect(() => realFft(new Float64Array(1))).toThrow(RangeError)
  })
})
