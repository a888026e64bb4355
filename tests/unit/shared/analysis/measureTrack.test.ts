import { describe, expect, it } from 'vitest'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { ENGINE_SETTINGS } from '../../../../shared/analysis/engineSettings'
import type { TrackPoint } from '../../../../shared/analysis/linkTracks'
import { BELOW_FLOOR_MARGIN_DB, measureTrack, type TrackContext } from '../../../../shared/analysis/measureTrack'
import { refinePeak } from '../../../../shared/analysis/refinePeak'
import { blackmanHarris } from '../../../../shared/analysis/blackmanHarris'
import { synthStrike } from '../../../support/synthStrike'
import { bandSource } from '../../../../shared/analysis/bandSource'
import { synthRealisticStrike } from '../../../../shared/synthesis/synthRealisticStrike'

const sampleRate = 48000
const truth = { frequencyHz: 1234.5, amplitudeDb: -20, decayDbPerS: 12 }
const signal = synthStrike([truth], { sampleRate, durationS: 2.2, noiseDb: -110, seed: 3 })
const windowLength = 4800
// A track as the STFT path gives it: frames every 50 ms, the level falling at the true rate.
const points: TrackPoint[] = Array.from({ length: 36 }, (_, i) => {
  const timeS = 0.1 + 0.05 * i
  return { frame: i, timeS, frequencyHz: truth.frequencyHz + 0.3 * Math.sin(i), amplitudeDb: truth.amplitudeDb - truth.decayDbPerS * timeS, noiseFloorDb: -100 }
})
const context: TrackContext = {
  onsetIndex: 0, startIndex: 0, endIndex: signal.length, windowLength,
  fitMarginDb: ENGINE_SETTINGS.fitMarginDb, minSnrDb: ENGINE_SETTINGS.minSnrDb, maxRefineS: ENGINE_SETTINGS.maxRefineS, modulation: ENGINE_SETTINGS.modulation,
}

describe('measureTrack', () => {
  it('measures a decaying partial: frequency from the long window, decay from the frames, onset amplitude', () => {
    const [p] = measureTrack(points, signal, sampleRate, context)
    // source: the synthesised truth (a synthetic signal with known answer)
    expect(Math.abs(centsBetween(p!.frequencyHz, truth.frequencyHz))).toBeLessThan(0.01)
    expect(p!.decayDbPerS).toBeCloseTo(truth.decayDbPerS, 6)
    expect(p!.amplitudeDb).toBeCloseTo(truth.amplitudeDb, 1)
  }, 60_000)

  it('stops after the one-bin step for a reading far under the reporting floor, and only then', () => {
    const full = measureTrack(points, signal, sampleRate, context)[0]!
    const far = measureTrack(points, signal, sampleRate, { ...context, reportFloorDb: full.amplitudeDb + BELOW_FLOOR_MARGIN_DB + 1 })[0]!
    const near = measureTrack(points, signal, sampleRate, { ...context, reportFloorDb: full.amplitudeDb + BELOW_FLOOR_MARGIN_DB - 1 })[0]!
    expect(near).toEqual(full)
    // The weak reading is the first refinement step's, with every other field the same.
    const half = windowLength / 2
    const start = Math.round(points[0]!.timeS * sampleRate - half)
    const length = Math.round(points[points.length - 1]!.timeS * sampleRate + half) - start
    const coarse = [...points.map(p => p.frequencyHz)].sort((a, b) => a - b)[points.length >> 1]!
    // The same step on the input's own windowed span (the track's band gives that up to rounding).
    const w = blackmanHarris(length)
    const windowed = signal.slice(start, start + length).map((x, i) => x * w[i]!)
    const oneStep = refinePeak({ re: windowed, im: new Float64Array(length), sampleRateHz: sampleRate, centerHz: 0 }, coarse, [1])
    expect(far.frequencyHz).toBeCloseTo(oneStep.frequencyHz, 6)
    expect({ ...far, frequencyHz: 0, amplitudeDb: 0 }).toEqual({ ...full, frequencyHz: 0, amplitudeDb: 0 })
    // Still within a fraction of a bin of the fine reading, and the level within a fraction of a dB.
    expect(Math.abs(far.frequencyHz - full.frequencyHz)).toBeLessThan(0.1 * sampleRate / length)
    expect(Math.abs(far.amplitudeDb - full.amplitudeDb)).toBeLessThan(0.5)
  }, 60_000)

  it('reads a tremolo carrier found as a mirrored close pair at the same level on a decimated band as at the input rate', () => {
    // A tremolo 4 Hz, m = 0.5, under 40 dB of SNR (so no sideband scan: the close-pair search finds carrier and sideband).
    const tremolo = { frequencyHz: 1234.5, amplitudeDb: -20, decayDbPerS: 6, tremolo: { rateHz: 4, index: 0.5 } }
    const x = synthRealisticStrike([tremolo], { sampleRate, durationS: 2.2, onsetS: 0, noiseDb: -110, seed: 5 })
    const track: TrackPoint[] = Array.from({ length: 36 }, (_, i) => {
      const timeS = 0.1 + 0.05 * i
      const amplitudeDb = tremolo.amplitudeDb - tremolo.decayDbPerS * timeS + 20 * Math.log10(1 + 0.5 * Math.cos(2 * Math.PI * 4 * timeS))
      return { frame: i, timeS, frequencyHz: tremolo.frequencyHz, amplitudeDb, noiseFloorDb: -55 }
    })
    const atInputRate = measureTrack(track, x, sampleRate, context)
    const bands = bandSource(x, sampleRate)
    bands(1000, 10, 1000, 0, 1e9) // tracks dearer than the DFT went before: the next ones get decimated bands
    const decimated = measureTrack(track, x, sampleRate, { ...context, bands })
    expect(atInputRate.map(p => p.modulationFrom)).toEqual(['sidebands'])
    expect(decimated.map(p => p.modulationFrom)).toEqual(['sidebands'])
    // source: sampling theorem — the decimated band's windowed DTFT, times its factor, is the input's
    expect(Math.abs(decimated[0]!.amplitudeDb - atInputRate[0]!.amplitudeDb)).toBeLessThan(0.05)
    expect(Math.abs(centsBetween(decimated[0]!.frequencyHz, atInputRate[0]!.frequencyHz))).toBeLessThan(0.01)
    // source: the synthesised truth (a carrier of −20 dB at the onset; the sidebands are no partials)
    expect(Math.abs(decimated[0]!.amplitudeDb - tremolo.amplitudeDb)).toBeLessThan(0.5)
  }, 60_000)
})
