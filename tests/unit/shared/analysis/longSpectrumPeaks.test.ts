import { describe, expect, it } from 'vitest'
import { longSpectrumPeaks } from '../../../../shared/analysis/longSpectrumPeaks'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 48000
const settings = (length: number) => ({ startIndex: 0, length, minFrequencyHz: 20, maxFrequencyHz: 2000, belowStrongestDb: 30, noiseMarginDb: 20 })
const steady = (partials: { frequencyHz: number, amplitudeDb: number }[], durationS: number, noiseDb?: number) =>
  synthStrike(partials.map(p => ({ ...p, decayDbPerS: 0 })), { sampleRate, durationS, noiseDb, seed: 7 })

describe('longSpectrumPeaks', () => {
  it('reads a steady sinusoid off the bin grid at its frequency and amplitude', () => {
    const x = steady([{ frequencyHz: 250.37, amplitudeDb: -20 }], 1)
    const peaks = longSpectrumPeaks(x, sampleRate, settings(48000))
    expect(peaks).toHaveLength(1)
    // The window's gain Σw/2 is removed, so a full-scale sine reads 0 dB (the DFT of A·cos at its frequency is A·Σw/2).
    // source: Harris (1978) Proc. IEEE 66(1), coherent gain of a window = Σw / N.
    expect(Math.abs(peaks[0]!.levelDb - -20)).toBeLessThan(0.05)
    // Parabolic interpolation of the dB magnitude (Grandke 1983) with the main lobe over ten bins: a small fraction of a Hz.
    expect(Math.abs(peaks[0]!.frequencyHz - 250.37)).toBeLessThan(0.02)
  })

  it('resolves two partials 9 Hz apart over 1 s but not over 0.2 s', () => {
    // source: Harris (1978): the 4-term Blackman–Harris main lobe is ±4 bins, i.e. 8 / T Hz wide.
    // Over 1 s that is 8 Hz (< 9 Hz: two peaks); over 0.2 s it is 40 Hz (one lobe).
    const x = steady([{ frequencyHz: 250, amplitudeDb: -20 }, { frequencyHz: 259, amplitudeDb: -24 }], 1)
    const long = longSpectrumPeaks(x, sampleRate, settings(48000))
    expect(long.map(p => Math.round(p.frequencyHz))).toEqual([250, 259])
    expect(long.every(p => p.prominenceDb > 6)).toBe(true)
    const short = longSpectrumPeaks(x, sampleRate, settings(9600))
    expect(short).toHaveLength(1)
  })

  it('gives a partial past the main lobe of a stronger one prominence, and none inside it', () => {
    // source: Harris (1978): the 4-term Blackman–Harris main lobe reaches ±4 bins (±4 Hz over 1 s).
    const at = (gapHz: number) => longSpectrumPeaks(
      steady([{ frequencyHz: 400, amplitudeDb: -20 }, { frequencyHz: 400 + gapHz, amplitudeDb: -30 }, { frequencyHz: 600, amplitudeDb: -30 }], 1, -100),
      sampleRate,
      settings(48000),
    )
    const outside = at(5)
    expect(outside.find(p => Math.abs(p.frequencyHz - 405) < 0.2)!.prominenceDb).toBeGreaterThan(6)
    expect(outside.find(p => Math.abs(p.frequencyHz - 600) < 0.2)!.prominenceDb).toBeGreaterThan(60)
    const inside = at(2.5)
    expect(inside.filter(p => Math.abs(p.frequencyHz - 401) < 4 && p.prominenceDb >= 6)).toHaveLength(1)
  })

  it('finds no peak in seeded white noise alone', () => {
    // A periodogram bin of white noise is exponentially distributed: 20 dB over the lower quartile
    // (0.29 × the mean) is 29 × the mean, probability e^−29 per bin. source: Kay (1988), Modern Spectral Estimation, §4.3.
    const x = synthStrike([], { sampleRate, durationS: 1, noiseDb: -40, seed: 3 })
    expect(longSpectrumPeaks(x, sampleRate, settings(48000))).toEqual([])
  })

  it('refuses a span outside the signal', () => {
    const x = new Float64Array(1000)
    expect(() => longSpectrumPeaks(x, sampleRate, settings(2000))).toThrow(RangeError)
    expect(() => longSpectrumPeaks(x, sampleRate, settings(32))).toThrow(RangeError)
  })
})
