import { describe, expect, it } from 'vitest'
import { shortTimePeaks } from '../../../../shared/analysis/shortTimePeaks'
import { trailingFloor } from '../../../../shared/analysis/trailingFloor'
import { synthStrike } from '../../../support/synthStrike'

describe('trailingFloor (minimum statistics, Martin 2001)', () => {
  it('lowers a frame\'s floor to the lowest a later frame showed, by at most the relief', () => {
    const trailing = new Float64Array(4).fill(Infinity)
    // Frames last first: the late floor (1) is carried back to earlier frames (floors 5, then 100).
    expect(Array.from(trailingFloor(Float64Array.of(0, 1, 1, 0), trailing, 1, 2, 10))).toEqual([0, 1, 1, 0])
    expect(Array.from(trailingFloor(Float64Array.of(0, 5, 0.5, 0), trailing, 1, 2, 10))).toEqual([0, 1, 0.5, 0])
    // 100 → 1 is 20 dB: a relief of 10 dB stops at 10 (power ratio 10^(10/10)).
    expect(Array.from(trailingFloor(Float64Array.of(0, 100, 100, 0), trailing, 1, 2, 10))).toEqual([0, 10, 10, 0])
    expect(() => trailingFloor(new Float64Array(2), new Float64Array(2), 1, 3, 10)).toThrow(RangeError)
    expect(() => trailingFloor(new Float64Array(4), new Float64Array(4), 1, 2, -1)).toThrow(RangeError)
  })

  it('finds the partials of a dense cluster that the banded floor took for noise', () => {
    // Six partials 14 Hz apart (a steel note field with its neighbours' rings, our own scenario)
    // fill their half-octave band with main lobes, so its lower quartile is their skirts; they
    // decay into the noise, which the last frames show.
    const cluster = [212, 226, 240, 254, 268]
    const partials = [...cluster, 282].map((frequencyHz, i) => ({ frequencyHz, amplitudeDb: i === 0 ? -36 : -25 - i, decayDbPerS: 80, phaseRad: i }))
    const sampleRate = 48000
    const x = synthStrike(partials, { sampleRate, durationS: 2, onsetS: 0, noiseDb: -90, seed: 7 })
    const settings = { windowLength: 13440, fftSize: 32768, hop: 3360, startIndex: 0, endIndex: x.length, peakThresholdDb: 80, noiseMarginDb: 20, minFrequencyHz: 20, maxFrequencyHz: 2000 }
    const seen = (maxFloorReliefDb: number) => {
      const frames = shortTimePeaks(x, sampleRate, { ...settings, maxFloorReliefDb })
      return cluster.filter(f => frames.filter(fr => fr.peaks.some(p => Math.abs(p.frequencyHz - f) < 2)).length >= 3)
    }
    expect(seen(0).length).toBeLessThanOrEqual(2)
    expect(seen(10).length).toBeGreaterThanOrEqual(4)
  })

  it('adds no peaks in noise alone', () => {
    const sampleRate = 48000
    const x = synthStrike([], { sampleRate, durationS: 2, noiseDb: -40, seed: 8 })
    const frames = shortTimePeaks(x, sampleRate, { windowLength: 4800, fftSize: 16384, hop: 1200, startIndex: 0, endIndex: x.length, peakThresholdDb: 80, noiseMarginDb: 20, minFrequencyHz: 20, maxFrequencyHz: 20000, maxFloorReliefDb: 10 })
    // Stationary noise: the later frames' floor is the same, so 20 dB over it is as rare as before.
    expect(frames.reduce((n, f) => n + f.peaks.length, 0)).toBeLessThan(frames.length)
  })
})
