import { describe, expect, it } from 'vitest'
import { basebandDtft } from '../../../../shared/analysis/basebandDtft'
import { blackmanHarris } from '../../../../shared/analysis/blackmanHarris'
import { decimateBand } from '../../../../shared/analysis/decimateBand'
import { realFft } from '../../../../shared/analysis/realFft'
import { windowBand } from '../../../../shared/analysis/windowBand'

const fftSize = 2 ** 15
const sampleRate = 48000
const binHz = sampleRate / fftSize

describe('decimateBand', () => {
  it('gives the same band again after a wider one was made in between (its working memory is reused)', () => {
    const x = new Float64Array(fftSize).map((_, n) => Math.cos(0.37 * n) + 0.5 * Math.sin(0.011 * n * (n % 7)))
    const spectrum = realFft(x)
    const first = decimateBand(spectrum, fftSize, sampleRate, 3000, 256, 5)
    const wide = decimateBand(spectrum, fftSize, sampleRate, 3000, 4096, 5)
    const again = decimateBand(spectrum, fftSize, sampleRate, 3000, 256, 5)
    // source: the DFT's decimation identity is a function of the spectrum alone; the same call gives the same numbers
    expect(again.re).toEqual(first.re)
    expect(again.im).toEqual(first.im)
    expect(wide.re).toHaveLength(4096)
  })

  it('turns a sinusoid on a bin into the complex exponential (A/2)·e^{i(ω − ω_c)n + iφ} at the band samples', () => {
    // source: Euler's formula, A cos(ωn + φ) = (A/2)(e^{i(ωn + φ)} + e^{−i(ωn + φ)}); only the positive half lies in the band
    const k = 3001
    const amplitude = 0.4
    const phase = 0.7
    const x = new Float64Array(fftSize).map((_, n) => amplitude * Math.cos((2 * Math.PI * k * n) / fftSize + phase))
    const band = decimateBand(realFft(x), fftSize, sampleRate, 2990, 256, 37)
    expect(band.factor).toBe(128)
    expect(band.sampleRateHz).toBe(375)
    expect(band.centerHz).toBeCloseTo(2990 * binHz, 12)
    for (const j of [0, 1, 100, 255]) {
      const n = 37 + j * 128
      const angle = (2 * Math.PI * (k - 2990) * n) / fftSize + phase
      expect(band.re[j]).toBeCloseTo((amplitude / 2) * Math.cos(angle), 12)
      expect(band.im[j]).toBeCloseTo((amplitude / 2) * Math.sin(angle), 12)
    }
  })

  it('keeps a windowed DTFT of the input, off the bins and beside a strong partial outside the band', () => {
    // source: sampling theorem — the windowed band is band-limited within the band's rate, so its
    // DTFT at the band's rate times the factor is the input's; reference summed directly here
    const x = new Float64Array(fftSize)
    for (let n = 0; n < fftSize; n++) {
      x[n] = 1e-2 * Math.exp(-n / 9000) * Math.cos(2 * Math.PI * (1234.56 / sampleRate) * n + 0.2)
        + 0.5 * Math.cos(2 * Math.PI * (2600.2 / sampleRate) * n)
    }
    const start = 2051
    const length = 20000
    const band = decimateBand(realFft(x), fftSize, sampleRate, Math.round(1234 / binHz), 512, start % 64)
    const span = windowBand(band, start, length)
    const w = blackmanHarris(length)
    for (const f of [1234.56, 1234.9, 1230]) {
      let re = 0
      let im = 0
      for (let n = 0; n < length; n++) {
        re += x[start + n]! * w[n]! * Math.cos((-2 * Math.PI * f * n) / sampleRate)
        im += x[start + n]! * w[n]! * Math.sin((-2 * Math.PI * f * n) / sampleRate)
      }
      const [v] = basebandDtft(span, [f])
      // The partial outside the band (−34 dB re it, 570 bins off) leaves under 10⁻⁴ of the reading.
      expect(Math.abs(Math.hypot(v!.re, v!.im) * band.factor - Math.hypot(re, im))).toBeLessThan(1e-4 * Math.hypot(re, im))
    }
  })

  it('refuses sizes that are not powers of two and a fractional centre', () => {
    const spectrum = realFft(new Float64Array(64))
    expect(() => decimateBand(spectrum, 64, sampleRate, 3, 12)).toThrow(RangeError)
    expect(() => decimateBand(spectrum, 64, sampleRate, 3.5, 16)).toThrow(RangeError)
  })
})
