import { describe, expect, it } from 'vitest'
import {
  MAIN_LOBE_BINS,
  analyzeSamples,
  bandNoiseFloor,
  chooseWindow,
  detectBeat,
  findStrike,
  linkTracks,
  readWavHeader,
  encodeWav,
  roughPartialSpacing,
  type SpectrumFrame,
} from '../../../../shared/analysis/index'
import { seededRandom } from '../../../support/seededRandom'
import { synthStrike } from '../../../support/synthStrike'

describe('chooseWindow', () => {
  it('makes the main lobe narrower than the partial spacing', () => {
    for (const spacingHz of [30, 60, 120, 400]) {
      const w = chooseWindow({ spacingHz, lowestHz: 1000, spanS: 10 }, 48000)
      expect(MAIN_LOBE_BINS / w.windowS).toBeLessThan(spacingHz)
      expect(w.fftSize & (w.fftSize - 1)).toBe(0)
      expect(w.zeroPad).toBeGreaterThanOrEqual(2)
      // Hop a quarter window, but no more than ~100 frames over the span; never over a window.
      expect(w.hop).toBe(Math.round(Math.max(w.windowLength / 4, (10 * 48000) / 100)))
      expect(w.hop).toBeLessThanOrEqual(w.windowLength)
    }
  })

  it('keeps the lowest partial clear of its mirror image at −f', () => {
    const w = chooseWindow({ spacingHz: Infinity, lowestHz: 65.41, spanS: 10 }, 48000)
    expect(MAIN_LOBE_BINS / w.windowS).toBeLessThan(2 * 65.41)
  })

  it('stays between max(30 ms, span / 100) and min(0.5 s, span / 3), unless forced', () => {
    expect(chooseWindow({ spacingHz: 5000, lowestHz: 5000, spanS: 2 }, 48000).windowS).toBeCloseTo(0.03, 4)
    expect(chooseWindow({ spacingHz: 5000, lowestHz: 5000, spanS: 4 }, 48000).windowS).toBeCloseTo(0.04, 4)
    expect(chooseWindow({ spacingHz: 3, lowestHz: 440, spanS: 1.2 }, 48000).windowS).toBeCloseTo(0.4, 4)
    expect(chooseWindow({ spacingHz: 3, lowestHz: 440, spanS: 4 }, 48000).windowS).toBeCloseTo(0.5, 4)
    expect(chooseWindow({ spacingHz: 300, lowestHz: 440, spanS: 4, windowS: 0.2 }, 48000).windowS).toBeCloseTo(0.2, 4)
  })

  it('is derived from the template when a target is given', () => {
    const x = synthStrike([{ frequencyHz: 110, amplitudeDb: -6, decayDbPerS: 5 }], { sampleRate: 48000, durationS: 2, onsetS: 0.05, noiseDb: -80 })
    // Two template partials 20 Hz apart need a window of at least 1.25 × 8 / 20 = 0.5 s.
    const result = analyzeSamples(x, 48000, { targetHz: 110, ratios: [1, 130 / 110] })
    expect(result.parameters.windowFrom).toBe('template')
    expect(result.parameters.windowS).toBeCloseTo(0.5, 3)
  })
})

describe('roughPartialSpacing', () => {
  it('sees the partials of a strike and their smallest spacing', () => {
    const x = synthStrike(
      [
        { frequencyHz: 200, amplitudeDb: -6, decayDbPerS: 5 },
        { frequencyHz: 551.3, amplitudeDb: -12, decayDbPerS: 5 },
        { frequencyHz: 1080.8, amplitudeDb: -20, decayDbPerS: 5 },
      ],
      { sampleRate: 48000, durationS: 1, noiseDb: -80 },
    )
    const rough = roughPartialSpacing(x, 48000, 0, x.length)!
    expect(rough.frequenciesHz).toHaveLength(3)
    expect(rough.lowestHz).toBeCloseTo(200, -1)
    expect(rough.spacingHz).toBeCloseTo(351.3, -1)
    expect(roughPartialSpacing(new Float64Array(48000), 48000, 0, 48000)).toBeNull()
  })
})

describe('linkTracks', () => {
  const frame = (timeS: number, ...frequencies: number[]): SpectrumFrame => ({
    timeS,
    peaks: frequencies.map(frequencyHz => ({ frequencyHz, amplitudeDb: -20, noiseFloorDb: -90, phaseRad: 0 })),
  })

  it('links peaks within the continuity threshold and drops short tracks', () => {
    const frames = Array.from({ length: 10 }, (_, i) =>
      frame(i * 0.01, 440 + 0.1 * i, 1000, ...(i >= 4 && i < 6 ? [3000] : []), ...(i % 2 ? [5000 + 300 * i] : [])),
    )
    const tracks = linkTracks(frames, { maxJumpCents: 5, minJumpHz: 0.5, maxGapFrames: 1, minFrames: 5 })
    expect(tracks.map(t => Math.round(t[0]!.frequencyHz))).toEqual([440, 1000])
    expect(tracks.every(t => t.length === 10)).toBe(true)
  })

  it('bridges a single missing frame but not two', () => {
    const frames = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11].map(i => frame(i * 0.01, ...(i === 3 || i === 7 || i === 8 ? [] : [500])))
    const tracks = linkTracks(frames, { maxJumpCents: 5, minJumpHz: 0.5, maxGapFrames: 1, minFrames: 3 })
    expect(tracks.map(t => t.length)).toEqual([6, 3])
  })
})

describe('detectBeat', () => {
  it('finds the rate of a modulated residual and ignores noise', () => {
    const times = Array.from({ length: 100 }, (_, i) => i * 0.02)
    const beating = times.map(t => 3 * Math.cos(2 * Math.PI * 2.3 * t + 0.4))
    expect(detectBeat(times, beating, { minRmsDb: 0.5, minShare: 0.4 })).toBeCloseTo(2.3, 1)
    const random = seededRandom(5)
    const noise = times.map(() => 0.3 * random.normal())
    expect(detectBeat(times, noise, { minRmsDb: 0.5, minShare: 0.4 })).toBeNull()
    const loudNoise = times.map(() => 3 * random.normal())
    expect(detectBeat(times, loudNoise, { minRmsDb: 0.5, minShare: 0.4 })).toBeNull()
  })
})

describe('bandNoiseFloor', () => {
  it('follows a sloping noise spectrum and ignores a strong peak', () => {
    const random = seededRandom(9)
    const n = 4096
    const power = new Float64Array(n)
    // Exponentially distributed bin powers (white noise per band) under a −3 dB/octave-ish slope.
    for (let k = 0; k < n; k++) power[k] = (-Math.log(1 - random.uniform()) * 1000) / (k + 10)
    for (let k = 2000; k < 2020; k++) power[k] = 1e6
    const floor = bandNoiseFloor(power, 4, n - 2, 96)
    // Lower quartile of an exponential distribution is ln(4/3) ≈ 0.288 of its mean (definition).
    expect(floor[100]! / (1000 / 110)).toBeGreaterThan(0.15)
    expect(floor[100]! / (1000 / 110)).toBeLessThan(0.5)
    expect(floor[2010]!).toBeLessThan(1)
    expect(floor[3000]!).toBeLessThan(floor[100]!)
  })
})

describe('findStrike and readWavHeader', () => {
  it('finds onset and end of a strike in noise', () => {
    const x = synthStrike([{ frequencyHz: 300, amplitudeDb: -6, decayDbPerS: 40 }], { sampleRate: 48000, durationS: 3, onsetS: 0.4, noiseDb: -66, seed: 3 })
    const s = findStrike(x, 48000, { attackSkipS: 0.005 })
    expect(Math.abs(s.onsetIndex / 48000 - 0.4)).toBeLessThan(0.001)
    expect(s.startIndex - s.onsetIndex).toBe(240)
    // −6 dB peak minus 3 dB RMS falls to the −66 dB noise in (57 − 6) / 40 ≈ 1.3 s.
    expect(s.endIndex / 48000).toBeGreaterThan(1.4)
    expect(s.endIndex / 48000).toBeLessThan(2)
    expect(Math.abs(s.noiseFloorDb + 66)).toBeLessThan(1.5)
  })

  it('reads the header of a WAV and tells truncated ones apart', () => {
    const bytes = encodeWav(new Float64Array(1000), 22050)
    expect(readWavHeader(bytes)).toMatchObject({ channels: 1, sampleRate: 22050, bitsPerSample: 16, frames: 1000, dataBytes: 2000 })
    expect(readWavHeader(bytes.slice(0, 30))).toBe('corrupt')
    expect(readWavHeader(new Uint8Array([1, 2, 3]))).toBeNull()
    expect(readWavHeader(new TextEncoder().encode('hello, not audio at all'))).toBeNull()
  })
})
