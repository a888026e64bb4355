import { describe, expect, it } from 'vitest'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { longSpectrumPeaks } from '../../../../shared/analysis/longSpectrumPeaks'
import { measureLongPeak } from '../../../../shared/analysis/measureLongPeak'
import { inputBand } from '../../../../shared/analysis/inputBand'
import { windowBand } from '../../../../shared/analysis/windowBand'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 48000
const onsetIndex = 2400
const startIndex = 2640
const length = sampleRate

/** The input as a band of factor 1 and its long window from `startIndex`. */
function spanOf(x: Float64Array) {
  const input = inputBand(x, sampleRate)
  return { input, windowed: windowBand(input, startIndex, length) }
}

function measure(x: Float64Array, frequencyHz: number) {
  return measureLongPeak(x, sampleRate, frequencyHz, { ...spanOf(x), startIndex, onsetIndex, halfWidthHz: 4, levelDb: -40, noiseFloorDb: -120 })
}

describe('measureLongPeak', () => {
  it.each([1, 2, 3])('reads a damped partial beside a stronger one 9 Hz away: frequency, decay, onset amplitude (seed %i)', (seed) => {
    // Exact synthetic strike, Σ A·10^(−d t/20)·cos(2πft + φ); the answers are its parameters.
    const weak = { frequencyHz: 255.5, amplitudeDb: -34, decayDbPerS: 18 }
    const x = synthStrike([{ frequencyHz: 246.5, amplitudeDb: -28, decayDbPerS: 10 }, weak], { sampleRate, durationS: 2, onsetS: onsetIndex / sampleRate, noiseDb: -85, seed })
    const p = measureLongPeak(x, sampleRate, 255.3, { ...spanOf(x), startIndex, onsetIndex, halfWidthHz: 4, levelDb: -40, noiseFloorDb: -120 })!
    expect(Math.abs(centsBetween(p.frequencyHz, weak.frequencyHz))).toBeLessThan(0.1)
    expect(Math.abs(p.decayDbPerS / weak.decayDbPerS - 1)).toBeLessThan(0.05)
    expect(Math.abs(p.amplitudeDb - weak.amplitudeDb)).toBeLessThan(0.5)
    expect(p.t60S).toBeCloseTo(60 / p.decayDbPerS, 10)
    // Five half-length windows give the decay; the span is the long window's.
    expect(p.frames).toBe(5)
    expect(p.startS).toBeCloseTo(startIndex / sampleRate, 10)
    expect(p.endS).toBeCloseTo((startIndex + length) / sampleRate, 10)
    expect(Math.abs(p.crossCheckCents!)).toBeLessThan(0.1)
    expect(p.uncertaintyDecayPct!).toBeLessThan(10)
  }, 30_000)

  it('cross-checks against the partial the long window holds, not a mallet\'s burst beside it that starts louder', () => {
    // A 400 dB/s burst 0.8 Hz over the partial, 17 dB louder at the blow: the pencil resolves both,
    // and by onset amplitude the burst was taken for the partial (cross-check 5.4 ¢, uncertainty
    // 35 ¢, decay uncertainty 5 700 %); over the window the partial carries more energy.
    const partial = { frequencyHz: 255.5, amplitudeDb: -30, decayDbPerS: 5 }
    const x = synthStrike([partial, { frequencyHz: 256.3, amplitudeDb: -13, decayDbPerS: 400 }], { sampleRate, durationS: 2, onsetS: onsetIndex / sampleRate, noiseDb: -85, seed: 1 })
    const p = measure(x, 255.5)!
    expect(Math.abs(centsBetween(p.frequencyHz, partial.frequencyHz))).toBeLessThan(0.05)
    expect(Math.abs(p.crossCheckCents!)).toBeLessThan(0.05)
    expect(p.uncertaintyCents!).toBeLessThan(0.1)
    expect(p.uncertaintyDecayPct!).toBeLessThan(5)
  }, 30_000)

  it('reads the decay of a partial that sinks into the noise within the long window from the frames over the floor', () => {
    // 120 dB/s from −12 dB: in the noise (−60 dB RMS, about −95 dB per line over 0.5 s) from about 0.6 s on.
    const fast = { frequencyHz: 255.5, amplitudeDb: -12, decayDbPerS: 120 }
    const x = synthStrike([{ frequencyHz: 246.5, amplitudeDb: -20, decayDbPerS: 10 }, fast], { sampleRate, durationS: 2, onsetS: onsetIndex / sampleRate, noiseDb: -60, seed: 5 })
    const peak = longSpectrumPeaks(x, sampleRate, { startIndex, length, minFrequencyHz: 20, maxFrequencyHz: 2000, belowStrongestDb: 40, noiseMarginDb: 20 })
      .find(q => Math.abs(q.frequencyHz - fast.frequencyHz) < 1)!
    const p = measureLongPeak(x, sampleRate, peak.frequencyHz, { ...spanOf(x), startIndex, onsetIndex, halfWidthHz: 4, levelDb: peak.levelDb, noiseFloorDb: peak.noiseFloorDb })!
    expect(p.frames).toBeLessThan(5)
    expect(Math.abs(p.decayDbPerS / fast.decayDbPerS - 1)).toBeLessThan(0.1)
    expect(Math.abs(p.amplitudeDb - fast.amplitudeDb)).toBeLessThan(1)
  }, 30_000)

  it('states a frequency uncertainty that covers a slower line 0.5 Hz away inside the partial\'s own (16 phases of it)', () => {
    // A room's tail of the partial, 14 dB under it: neither reading resolves it in 1 s, both are pulled,
    // and their decays disagree. The truth is the partial's own frequency; within three stated
    // uncertainties every time (GUM k = 3), and where the decays disagree most, the pull widens it.
    const partial = { frequencyHz: 255.5, amplitudeDb: -20, decayDbPerS: 30, phaseRad: 0 }
    let widest = { decayPct: 0, uncertaintyCents: 0 }
    for (let k = 0; k < 16; k++) {
      const tail = { frequencyHz: 256, amplitudeDb: -34, decayDbPerS: 6, phaseRad: (2 * Math.PI * k) / 16 }
      const x = synthStrike([partial, tail], { sampleRate, durationS: 2, onsetS: onsetIndex / sampleRate, noiseDb: -85, seed: k + 1 })
      const p = measure(x, 255.5)!
      expect(Math.abs(centsBetween(p.frequencyHz, partial.frequencyHz))).toBeLessThan(3 * p.uncertaintyCents!)
      if (p.uncertaintyDecayPct! > widest.decayPct) widest = { decayPct: p.uncertaintyDecayPct!, uncertaintyCents: p.uncertaintyCents! }
    }
    // The widest decay disagreement (over 100 % of the decay) pulls the frequency by more than 1 ¢:
    // its pull, some 12 dB/s, is 0.3 Hz (u_f = u_α / 2π, partialUncertaintyCents).
    expect(widest.decayPct).toBeGreaterThan(100)
    expect(widest.uncertaintyCents).toBeGreaterThan(1)
  }, 30_000)

  it.each([9, 10, 11])('gives no reading where the pencil finds no component (seeded noise alone, seed %i)', (seed) => {
    const x = synthStrike([], { sampleRate, durationS: 2, noiseDb: -60, seed })
    expect(measure(x, 300)).toBeNull()
  }, 30_000)

  it('refuses a frequency outside the band and a window outside the signal', () => {
    const x = new Float64Array(2 * sampleRate)
    expect(() => measure(x, 0)).toThrow(RangeError)
    expect(() => measure(x, sampleRate)).toThrow(RangeError)
    const input = inputBand(x, sampleRate)
    const windowed = { re: new Float64Array(length), im: new Float64Array(length), sampleRateHz: sampleRate, centerHz: 0, real: true }
    expect(() => measureLongPeak(x, sampleRate, 300, { windowed, input, startIndex: 2 * sampleRate - 10, onsetIndex, halfWidthHz: 4, levelDb: -40, noiseFloorDb: -120 })).toThrow(RangeError)
  })
})
