import { describe, expect, it } from 'vitest'
import { basebandDtft } from '../../../../shared/analysis/basebandDtft'
import { directDft } from '../../../../shared/analysis/directDft'

/** Seeded uniform noise in [−1, 1) (a 32-bit LCG, Numerical Recipes constants). */
function noise(n: number, seed: number): Float64Array {
  const out = new Float64Array(n)
  let state = seed >>> 0
  for (let i = 0; i < n; i++) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0
    out[i] = state / 2 ** 31 - 1
  }
  return out
}

describe('basebandDtft', () => {
  it('equals the direct DFT of a real signal at bin frequencies', () => {
    // source: definition of the DFT X[k] = Σ x[n] e^{−2πikn/N}, summed directly by directDft
    const n = 256
    const sampleRate = 1000
    const x = noise(n, 7)
    const dft = directDft(x)
    const values = basebandDtft({ re: x, im: new Float64Array(n), sampleRateHz: sampleRate, centerHz: 0 }, [5, 40, 99].map(k => (k * sampleRate) / n))
    ;[5, 40, 99].forEach((k, i) => {
      expect(values[i]!.re).toBeCloseTo(dft[2 * k]!, 10)
      expect(values[i]!.im).toBeCloseTo(dft[2 * k + 1]!, 10)
    })
  })

  it('gives the geometric sum of a complex exponential off its frequency, input frequencies shifted by the centre', () => {
    // source: geometric series Σ_{j<N} e^{iθj} = (1 − e^{iθN}) / (1 − e^{iθ}), θ = 2π(f0 − f)/fs
    const n = 3001
    const rate = 187.5
    const centerHz = 1000
    const f0 = 1003.3
    const re = new Float64Array(n)
    const im = new Float64Array(n)
    for (let j = 0; j < n; j++) {
      re[j] = Math.cos((2 * Math.PI * (f0 - centerHz) * j) / rate)
      im[j] = Math.sin((2 * Math.PI * (f0 - centerHz) * j) / rate)
    }
    for (const f of [1003.3, 1003.31, 995, 1040]) {
      const [v] = basebandDtft({ re, im, sampleRateHz: rate, centerHz }, [f])
      const theta = (2 * Math.PI * (f0 - f)) / rate
      const expected = Math.abs(theta) < 1e-15 ? n : Math.abs(Math.sin((theta * n) / 2) / Math.sin(theta / 2))
      expect(Math.hypot(v!.re, v!.im)).toBeCloseTo(expected, 7)
    }
  })

  it('gives the same values for a real span by the real recurrence as by the complex one', () => {
    // source: definition of the DTFT — a real signal is a complex one with a zero imaginary part
    const x = noise(4801, 3)
    const span = { re: x, im: new Float64Array(x.length), sampleRateHz: 48000, centerHz: 0 }
    const frequencies = [61.5, 1234.567, 20000]
    const complex = basebandDtft(span, frequencies)
    const real = basebandDtft({ ...span, real: true }, frequencies)
    frequencies.forEach((_, i) => {
      expect(real[i]!.re).toBeCloseTo(complex[i]!.re, 8)
      expect(real[i]!.im).toBeCloseTo(complex[i]!.im, 8)
    })
  })

  it('reads each frequency the same, bit for bit, alone or in a group of any size (three run in one pass)', () => {
    const span = { re: noise(999, 8), im: noise(999, 9), sampleRateHz: 3000, centerHz: 440 }
    const frequencies = [430, 437.5, 440, 441.25, 452, 460, 471.5]
    for (let count = 1; count <= frequencies.length; count++) {
      const group = basebandDtft(span, frequencies.slice(0, count))
      expect(group).toHaveLength(count)
      group.forEach((x, i) => expect(x).toStrictEqual(basebandDtft(span, [frequencies[i]!])[0]))
    }
  })

  it('refuses a span without a rate', () => {
    expect(() => basebandDtft({ re: new Float64Array(4), im: new Float64Array(4), sampleRateHz: 0, centerHz: 0 }, [1])).toThrow(RangeError)
  })
})
