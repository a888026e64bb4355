import { describe, expect, it } from 'vitest'
import { decimateBand } from '../../../../shared/analysis/decimateBand'
import { mixDownCoarse } from '../../../../shared/analysis/mixDownCoarse'
import { bandExponentialAt } from '../../../support/bandExponential'
import { realFft } from '../../../../shared/analysis/realFft'

const sampleRate = 8000
const size = 32768

/** A·e^{−δn}·cos(ωn + φ) from `onset` on, zero before it, `size` samples. */
function dampedCosine(amplitude: number, frequencyHz: number, damping: number, phase: number, onset = 0): Float64Array {
  const out = new Float64Array(size)
  for (let i = onset; i < size; i++) out[i] = amplitude * Math.exp(-damping * i) * Math.cos((2 * Math.PI * frequencyHz * i) / sampleRate + phase)
  return out
}

/** The band of 1024 bins (factor 32) around `frequencyHz`, with a sample at `alignIndex`. */
function coarseBand(signal: Float64Array, frequencyHz: number, alignIndex: number) {
  const spectrum = realFft(signal)
  const centreBin = Math.round((frequencyHz * size) / sampleRate / 256) * 256
  return decimateBand(spectrum, size, sampleRate, centreBin, 1024, alignIndex % 32)
}

describe('mixDownCoarse', () => {
  it('turns a damped cosine into (A/2)·e^{iφ}·H(u)·u^t, H over taps one coarse sample (F input samples) apart', () => {
    const amplitude = 0.8
    const damping = 2e-4
    const phase = 0.7
    // The strike starts at sample 3000: every output's filter lies after it.
    const signal = dampedCosine(amplitude, 1033, damping, phase, 3000)
    const settings = { startIndex: 3200, endIndex: 30000, factor: 128 }
    // The coarse band's centre is 1000 Hz: its samples are turned by 30 Hz.
    const coarse = coarseBand(signal, 1030, settings.startIndex)
    expect(coarse.centerHz).toBe(1000)
    const band = mixDownCoarse(coarse, 1030, settings)
    expect(band.tapStep).toBe(32)
    const tone = { amplitude, damping, phase, offsetRad: (2 * Math.PI * 3) / sampleRate }
    for (const m of [0, 5, band.re.length - 1]) {
      const expected = bandExponentialAt(band, m, tone)
      // What leaks is the onset's and the image's share beyond the low-pass's stopband edge (≥ 48.5 dB down).
      expect(Math.hypot(band.re[m]! - expected.re, band.im[m]! - expected.im)).toBeLessThan(expected.magnitude * 10 ** (-48.5 / 20))
    }
  })

  it('removes a tone inside the coarse band but beyond the stopband edge by the stopband attenuation', () => {
    // The coarse band holds 1200 ± 125 Hz; at factor 160 the band rate is 50 Hz and the stopband starts 43.75 Hz out.
    const signal = dampedCosine(1, 1290, 0, 0.3)
    const band = mixDownCoarse(coarseBand(signal, 1210, 0), 1210, { startIndex: 0, endIndex: 30000, factor: 160 })
    let peak = 0
    for (let m = 0; m < band.re.length; m++) peak = Math.max(peak, Math.hypot(band.re[m]!, band.im[m]!))
    expect(band.re.length).toBeGreaterThan(100)
    // Design attenuation 50 dB, as the one-stage down-mix's (mixDownBand.test.ts).
    expect(20 * Math.log10(peak / 0.5)).toBeLessThan(-48.5)
  })

  it('keeps the filter inside the span: the last output\'s filter ends before endIndex', () => {
    const signal = dampedCosine(1, 500, 0, 0)
    const band = mixDownCoarse(coarseBand(signal, 500, 1024), 500, { startIndex: 1024, endIndex: 9000, factor: 128 })
    const last = band.firstIndex + (band.re.length - 1) * 128 + ((band.taps.length - 1) / 2) * band.tapStep
    expect(last).toBeLessThan(9000)
    expect(last + 128).toBeGreaterThanOrEqual(9000)
  })

  it('refuses a factor the coarse band does not divide, and a span off its samples', () => {
    const coarse = coarseBand(dampedCosine(1, 500, 0, 0), 500, 0)
    expect(() => mixDownCoarse(coarse, 500, { startIndex: 0, endIndex: 9000, factor: 48 })).toThrow(RangeError)
    expect(() => mixDownCoarse(coarse, 500, { startIndex: 0, endIndex: 9000, factor: 32 })).toThrow(RangeError)
    expect(() => mixDownCoarse(coarse, 500, { startIndex: 5, endIndex: 9000, factor: 128 })).toThrow(RangeError)
  })
})
