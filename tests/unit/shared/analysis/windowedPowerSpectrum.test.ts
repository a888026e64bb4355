import { describe, expect, it } from 'vitest'
import { windowedPowerSpectrum } from '../../../../shared/analysis/windowedPowerSpectrum'

describe('windowedPowerSpectrum', () => {
  it('puts a sinusoid on a bin centre at (A·N/2)² there, under a rectangular window, and nothing elsewhere', () => {
    // source: the DFT of A·cos(2πk₀n/N) is A·N/2 at k₀ (analytic)
    const n = 256
    const signal = Float64Array.from({ length: 300 }, (_, i) => 0.5 * Math.cos((2 * Math.PI * 10 * (i - 20)) / n))
    const power = windowedPowerSpectrum(signal, 20, new Float64Array(n).fill(1), n)
    expect(power.length).toBe(n / 2 + 1)
    expect(power[10]).toBeCloseTo((0.5 * n / 2) ** 2, 6)
    expect(power[11]! + power[9]!).toBeLessThan(1e-18)
  })

  it('zero-pads to the transform and refuses a stretch outside the signal or a transform too short', () => {
    const signal = new Float64Array(100).fill(1)
    // source: Σ of N ones is N at 0 Hz, whatever the padding (analytic)
    expect(windowedPowerSpectrum(signal, 0, new Float64Array(64).fill(1), 256)[0]).toBeCloseTo(64 ** 2, 9)
    expect(() => windowedPowerSpectrum(signal, 50, new Float64Array(64), 64)).toThrow(RangeError)
    expect(() => windowedPowerSpectrum(signal, 0, new Float64Array(64), 32)).toThrow(RangeError)
  })
})
