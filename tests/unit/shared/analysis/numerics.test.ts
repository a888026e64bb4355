import { describe, expect, it } from 'vitest'
import {
  blackmanHarris,
  directDft,
  dtftAt,
  fitLine,
  nextPowerOfTwo,
  parabolicPeak,
  realFft,
  selectQuantile,
} from '../../../../shared/analysis/index'
import { basebandDtft } from '../../../../shared/analysis/basebandDtft'
import { seededRandom } from '../../../support/seededRandom'

/** Magnitude in dB (re the peak) of a window's transform, sampled `pad` times per bin. */
function windowResponseDb(length: number, pad: number): Float64Array {
  const w = blackmanHarris(length)
  const buffer = new Float64Array(length * pad)
  buffer.set(w)
  const spectrum = realFft(buffer)
  const half = (length * pad) / 2
  const db = new Float64Array(half)
  const peak = Math.hypot(spectrum[0]!, spectrum[1]!)
  for (let k = 0; k < half; k++) db[k] = 20 * Math.log10(Math.hypot(spectrum[2 * k]!, spectrum[2 * k + 1]!) / peak + 1e-300)
  return db
}

describe('4-term Blackman–Harris window', () => {
  const pad = 64
  const db = windowResponseDb(256, pad)

  it('has its first null at 4 bins (main lobe 8 bins wide)', () => {
    let k = 1
    while (db[k + 1]! < db[k]!) k++
    // source: Harris (1978) Proc. IEEE 66(1) 51–83, minimum 4-term Blackman–Harris, main lobe ±4 bins
    expect(k / pad).toBeGreaterThan(3.9)
    expect(k / pad).toBeLessThan(4.05)
  })

  it('has its highest sidelobe at −92 dB', () => {
    let k = 1
    while (db[k + 1]! < db[k]!) k++
    let highest = -Infinity
    for (let j = k; j < db.length; j++) highest = Math.max(highest, db[j]!)
    // source: Harris (1978) Proc. IEEE 66(1) 51–83, Table 1: highest sidelobe −92 dB
    expect(highest).toBeGreaterThan(-93)
    expect(highest).toBeLessThan(-91.5)
  })

  it('has the tabulated coherent gain, noise bandwidth and 3 dB / 6 dB widths', () => {
    const n = 4096
    const w = blackmanHarris(n)
    let sum = 0
    let sumSq = 0
    for (const v of w) {
      sum += v
      sumSq += v * v
    }
    expect(sum / n).toBeCloseTo(0.36, 2) // source: Harris (1978) Table 1, coherent gain 0.36
    expect((n * sumSq) / sum ** 2).toBeCloseTo(2.0, 2) // source: Harris (1978) Table 1, ENBW 2.00 bins
    const width = (levelDb: number) => {
      let k = 0
      while (db[k]! > levelDb) k++
      return (2 * k) / pad
    }
    expect(width(-3.01)).toBeCloseTo(1.9, 1) // source: Harris (1978) Table 1, 3.0-dB bandwidth 1.90 bins
    expect(width(-6.02)).toBeCloseTo(2.72, 1) // source: Harris (1978) Table 1, 6.0-dB bandwidth 2.72 bins
  })

  it('takes a period that need not be whole: w[n] = w(n / period), as Harris writes the window', () => {
    const [a0, a1, a2, a3] = [0.35875, 0.48829, 0.14128, 0.01168] // source: Harris (1978) Table 1, minimum 4-term Blackman–Harris
    const period = 3000.4 / 7
    const w = blackmanHarris(429, period)
    for (const n of [0, 1, 100, 214, 300, 428]) {
      const x = (2 * Math.PI * n) / period
      expect(w[n]).toBeCloseTo(a0 - a1 * Math.cos(x) + a2 * Math.cos(2 * x) - a3 * Math.cos(3 * x), 12)
    }
    expect(Array.from(blackmanHarris(500, 500))).toEqual(Array.from(blackmanHarris(500)))
    expect(() => blackmanHarris(10, 0)).toThrow(RangeError)
  })

  it('is symmetric in its periodic form and refuses bad lengths', () => {
    const w = blackmanHarris(64)
    for (let n = 1; n < 64; n++) expect(w[n]).toBeCloseTo(w[64 - n]!, 14)
    expect(w[32]).toBeCloseTo(1, 12) // a0 + a1 + a2 + a3 = 1 at the centre
    expect(() => blackmanHarris(0)).toThrow(RangeError)
  })
})

describe('FFT and DTFT', () => {
  it('realFft equals a direct DFT on random input to 1e-9 relative', () => {
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

  it('realFft refuses lengths that are not powers of two', () => {
    expect(() => realFft(new Float64Array(100))).toThrow(RangeError)
  })

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

describe('small building blocks', () => {
  it('parabolicPeak finds the vertex of an exact parabola', () => {
    const y = (x: number) => -3 * (x - 0.3) ** 2 + 7
    const v = parabolicPeak(y(-1), y(0), y(1))
    expect(v.offset).toBeCloseTo(0.3, 12)
    expect(v.value).toBeCloseTo(7, 12)
    expect(parabolicPeak(1, 1, 1)).toEqual({ offset: 0, value: 1 })
  })

  it('fitLine recovers an exact line, and weights change which points count', () => {
    const x = [0, 1, 2, 3, 4]
    const fit = fitLine(x, x.map(v => 5 - 2 * v))
    expect(fit.slope).toBeCloseTo(-2, 12)
    expect(fit.intercept).toBeCloseTo(5, 12)
    expect(fit.r2).toBeCloseTo(1, 12)
    const y = [0, 1, 2, 3, 100]
    expect(fitLine(x, y, [1, 1, 1, 1, 0]).slope).toBeCloseTo(1, 12)
    expect(fitLine(x, y).slope).toBeGreaterThan(10)
    expect(() => fitLine([1, 1], [2, 3])).toThrow(RangeError)
  })

  it('fitLine r² follows its definition 1 − SS_res / SS_tot', () => {
    const x = [0, 1, 2, 3]
    const y = [0, 2, 1, 3]
    const fit = fitLine(x, y)
    // Hand computation: slope 0.8, intercept 0.3, SS_res 1.8, SS_tot 5 → r² = 0.64.
    expect(fit.slope).toBeCloseTo(0.8, 12)
    expect(fit.intercept).toBeCloseTo(0.3, 12)
    expect(fit.r2).toBeCloseTo(0.64, 12)
  })

  it('selectQuantile agrees with sorting', () => {
    const random = seededRandom(3)
    const values = Array.from({ length: 1001 }, () => random.uniform())
    const sorted = [...values].sort((a, b) => a - b)
    expect(selectQuantile(values, 0.5)).toBe(sorted[500])
    expect(selectQuantile(values, 0.25)).toBe(sorted[250])
    expect(selectQuantile(values, 0)).toBe(sorted[0])
    expect(selectQuantile(values, 1)).toBe(sorted[1000])
    expect(values.length).toBe(1001)
    expect(Number.isNaN(selectQuantile([], 0.5))).toBe(true)
  })

  it('nextPowerOfTwo', () => {
    expect([1, 2, 3, 4, 5, 1000, 1024, 1025].map(nextPowerOfTwo)).toEqual([1, 2, 4, 4, 8, 1024, 1024, 2048])
  })
})
