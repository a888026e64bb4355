import { describe, expect, it } from 'vitest'
import { bandSource } from '../../../../shared/analysis/bandSource'
import { basebandDtft } from '../../../../shared/analysis/basebandDtft'
import { cachedBlackmanHarris } from '../../../../shared/analysis/cachedBlackmanHarris'
import { inputBand } from '../../../../shared/analysis/inputBand'
import { windowBand } from '../../../../shared/analysis/windowBand'

const sampleRate = 48000

describe('windowBand', () => {
  it('reads a steady sinusoid at amplitude × coherent gain × length / 2 over exactly the asked span', () => {
    // source: Harris (1978) Table 1 — coherent gain of the minimum 4-term Blackman–Harris window 0.36 (a0 = 0.35875)
    const amplitude = 0.25
    const x = new Float64Array(131072).map((_, n) => amplitude * Math.cos(2 * Math.PI * (1000.3 / sampleRate) * n + 1))
    const bands = bandSource(x, sampleRate)
    for (const [start, length] of [[1000, 48000], [3333, 20011]] as const) {
      const band = bands(1000, 30, Math.floor(length / 64), start, 1e9) // a span dearer than the DFT: decimated
      const span = windowBand(band, start, length)
      expect(span.durationS).toBeCloseTo(length / sampleRate, 12)
      const [v] = basebandDtft(span, [1000.3])
      expect(Math.abs((2 * Math.hypot(v!.re, v!.im) * band.factor) / (0.35875 * length * amplitude) - 1)).toBeLessThan(1e-4)
    }
  })

  it('windows the input itself sample by sample, its imaginary part left all zeros', () => {
    const x = new Float64Array(5000).map((_, n) => Math.sin(0.01 * n * n))
    const span = windowBand(inputBand(x, sampleRate), 1200, 2048)
    const w = cachedBlackmanHarris(2048)
    expect(span.real).toBe(true)
    expect(span.re).toHaveLength(2048)
    expect(span.im).toHaveLength(2048)
    for (const j of [0, 1, 777, 2047]) {
      // source: definition of a windowed frame, x_w[j] = x[start + j]·w[j] (Harris 1978, eq. 1)
      expect(span.re[j]).toBe(x[1200 + j]! * w[j]!)
      expect(span.im[j]).toBe(0)
    }
  })

  it('refuses a span that does not start on a band sample', () => {
    const bands = bandSource(new Float64Array(65536).fill(0.1), sampleRate)
    bands(1000, 30, 64, 0, 1e9)
    const band = bands(1000, 30, 64, 0)
    expect(band.factor).toBeGreaterThan(1)
    expect(() => windowBand(band, band.factor + 1, 10000)).toThrow(RangeError)
  })
})
