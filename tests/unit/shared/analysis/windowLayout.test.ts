import { describe, expect, it } from 'vitest'
import { shortTimePeaks } from '../../../../shared/analysis/shortTimePeaks'
import { windowLayout } from '../../../../shared/analysis/windowLayout'

describe('windowLayout', () => {
  it('zero-pads to the next power of two at least the given multiple of the window (1.25 unless told), and gives both lengths in seconds', () => {
    // source: arithmetic — 2 × 24 000 = 48 000 ≤ 2¹⁶ = 65 536; 24 000 / 48 000 Hz = 0.5 s; 6 000 / 48 000 Hz = 0.125 s
    expect(windowLayout(24000, 6000, 48000, 2)).toEqual({ windowLength: 24000, fftSize: 65536, hop: 6000, windowS: 0.5, hopS: 0.125, zeroPad: 65536 / 24000 })
    // source: arithmetic — 1.25 × 24 000 = 30 000 ≤ 2¹⁵ = 32 768
    expect(windowLayout(24000, 6000, 48000)).toMatchObject({ fftSize: 32768, zeroPad: 32768 / 24000 })
    // source: arithmetic — 2 × 1 024 = 2¹¹ exactly, so the padding is exactly 2
    expect(windowLayout(1024, 256, 44100, 2)).toMatchObject({ fftSize: 2048, zeroPad: 2, windowS: 1024 / 44100, hopS: 256 / 44100 })
    // source: arithmetic — 2 × 1 025 = 2 050 > 2¹¹, so 2¹² = 4 096; 1.25 × 1 025 = 1 281.25 > 2¹⁰, so 2¹¹
    expect(windowLayout(1025, 256, 44100, 2).fftSize).toBe(4096)
    expect(windowLayout(1025, 256, 44100).fftSize).toBe(2048)
    // source: arithmetic — 1.25 × 1 639 = 2 048.75 > 2¹¹ (the padding never falls under 1.25)
    expect(windowLayout(1639, 256, 44100).fftSize).toBe(4096)
  })

  it('reads a lone sinusoid\'s frame level within 0.015 dB and its frequency within 0.002 bin at the least padding, wherever it falls between bins', () => {
    const sampleRate = 48000
    const windowLength = 1500
    const layout = windowLayout(windowLength, 375, sampleRate)
    expect(layout.zeroPad).toBeLessThan(1.4)
    const binHz = sampleRate / windowLength
    for (let k = 0; k <= 10; k++) {
      const frequencyHz = (40 + k / 20) * binHz
      const amplitude = 0.3
      const signal = new Float64Array(4 * windowLength).map((_, n) => amplitude * Math.cos((2 * Math.PI * frequencyHz * n) / sampleRate + 0.7))
      const frames = shortTimePeaks(signal, sampleRate, { ...layout, startIndex: 0, endIndex: signal.length, peakThresholdDb: 80, noiseMarginDb: 0, minFrequencyHz: 100, maxFrequencyHz: 20000 })
      const peak = frames[0]!.peaks.reduce((a, b) => (b.amplitudeDb > a.amplitudeDb ? b : a))
      // source: the sinusoid's own amplitude, 20·log10(0.3) dB re full scale; parabolic interpolation of the dB magnitude (Smith & Serra 1987) on a 4-term Blackman–Harris window (Harris 1978)
      expect(Math.abs(peak.amplitudeDb - 20 * Math.log10(amplitude))).toBeLessThan(0.015)
      expect(Math.abs(peak.frequencyHz - frequencyHz) / binHz).toBeLessThan(0.002)
    }
  })

  it('refuses a fractional or empty window or hop and a rate that is not positive', () => {
    expect(() => windowLayout(100.5, 25, 48000)).toThrow(RangeError)
    expect(() => windowLayout(0, 25, 48000)).toThrow(RangeError)
    expect(() => windowLayout(100, 0, 48000)).toThrow(RangeError)
    expect(() => windowLayout(100, 25, 0)).toThrow(RangeError)
    expect(() => windowLayout(100, 25, 48000, 0.5)).toThrow(RangeError)
  })
})
