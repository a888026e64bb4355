import { describe, expect, it } from 'vitest'
import { mixDownBand } from '../../../../shared/analysis/mixDownBand'
import { bandExponentialAt } from '../../../support/bandExponential'

const sampleRate = 8000

/** A·e^{−δn}·cos(ωn + φ) over `n` samples. */
function dampedCosine(n: number, amplitude: number, frequencyHz: number, damping: number, phase: number): Float64Array {
  const out = new Float64Array(n)
  for (let i = 0; i < n; i++) out[i] = amplitude * Math.exp(-damping * i) * Math.cos((2 * Math.PI * frequencyHz * i) / sampleRate + phase)
  return out
}

describe('mixDownBand', () => {
  it('turns a damped cosine into the complex exponential (A/2)·e^{iφ}·H(u)·u^t, u = z·e^{−iω_c}', () => {
    const amplitude = 0.8
    const damping = 2e-4
    const phase = 0.7
    const signal = dampedCosine(16000, amplitude, 1003, damping, phase)
    const band = mixDownBand(signal, sampleRate, 1000, { startIndex: 100, endIndex: 16000, factor: 50 })
    // Exact: H(u) = Σ h[j]·u^{j − c}, with u = e^{−δ + i(ω − ω_c)} per input sample (an identity of linear filtering).
    const tone = { amplitude, damping, phase, offsetRad: (2 * Math.PI * 3) / sampleRate }
    for (const m of [0, 5, band.re.length - 1]) {
      const expected = bandExponentialAt(band, m, tone)
      // The negative-frequency image lies 2006 Hz away, deep in the stopband (≥ 48.5 dB down).
      expect(Math.hypot(band.re[m]! - expected.re, band.im[m]! - expected.im)).toBeLessThan(expected.magnitude * 10 ** (-48.5 / 20))
    }
  })

  it('keeps the filter inside the span and reports the band\'s rate and first sample', () => {
    const signal = dampedCosine(10000, 1, 500, 0, 0)
    const band = mixDownBand(signal, sampleRate, 500, { startIndex: 1000, endIndex: 9000, factor: 40 })
    const delay = (band.taps.length - 1) / 2
    expect(band.sampleRateHz).toBe(200)
    expect(band.firstIndex).toBe(1000 + delay)
    // The last output's filter ends inside the span; one more would not.
    const last = 1000 + (band.re.length - 1) * 40 + band.taps.length
    expect(last).toBeLessThanOrEqual(9000)
    expect(last + 40).toBeGreaterThan(9000)
  })

  it('removes a tone outside the band by at least the stopband attenuation', () => {
    const signal = dampedCosine(20000, 1, 1400, 0, 0.3)
    const band = mixDownBand(signal, sampleRate, 1000, { startIndex: 0, endIndex: 20000, factor: 80 })
    let peak = 0
    for (let m = 0; m < band.re.length; m++) peak = Math.max(peak, Math.hypot(band.re[m]!, band.im[m]!))
    // 400 Hz away, beyond the stopband edge (7/8 of the 100 Hz band rate); design attenuation 50 dB.
    expect(20 * Math.log10(peak / 0.5)).toBeLessThan(-48.5)
  })

  it('gives the same band again after a longer filter was used in between (its taps\' memory is reused)', () => {
    const x = dampedCosine(8000, 0.5, 1000, 0.0005, 0.2)
    const settings = { startIndex: 0, endIndex: 4000, factor: 8 }
    const first = mixDownBand(x, sampleRate, 990, settings)
    mixDownBand(x, sampleRate, 990, { startIndex: 0, endIndex: 8000, factor: 64 })
    const again = mixDownBand(x, sampleRate, 990, settings)
    // source: a linear filter is a function of its input alone; the same call gives the same numbers
    expect(again.re).toEqual(first.re)
    expect(again.im).toEqual(first.im)
  })

  it('refuses a bad factor, span or centre', () => {
    const signal = new Float64Array(1000)
    expect(() => mixDownBand(signal, sampleRate, 100, { startIndex: 0, endIndex: 1000, factor: 1 })).toThrow(RangeError)
    expect(() => mixDownBand(signal, sampleRate, 100, { startIndex: 0, endIndex: 2000, factor: 4 })).toThrow(RangeError)
    expect(() => mixDownBand(signal, sampleRate, 5000, { startIndex: 0, endIndex: 1000, factor: 4 })).toThrow(RangeError)
  })
})
