import { describe, expect, it } from 'vitest'
import { alignChannels } from '../../../../shared/analysis/alignChannels'
import { mixToMono } from '../../../../shared/analysis/mixToMono'
import { synthRealisticStrike } from '../../../../shared/synthesis/synthRealisticStrike'
import { seededRandom } from '../../../support/seededRandom'

const sampleRate = 44100
const strike = (seed: number) => synthRealisticStrike([
  { frequencyHz: 440, amplitudeDb: -10, decayDbPerS: 8 },
  { frequencyHz: 1000, amplitudeDb: -16, decayDbPerS: 20 },
  { frequencyHz: 2500, amplitudeDb: -22, decayDbPerS: 40 },
], { sampleRate, durationS: 1, onsetS: 0.1, seed, noiseDb: -80, mallet: { levelDb: -20, durationS: 0.005 } })

/** x delayed by `delay` samples (later for delay > 0), times `gain`. */
const delayed = (x: Float64Array, delay: number, gain = 1) => Float64Array.from(x, (_, i) => (i - delay >= 0 && i - delay < x.length ? gain * x[i - delay]! : 0))

describe('alignChannels', () => {
  it('finds how much later a second microphone heard the strike, either way round', () => {
    const x = strike(5)
    // source: the delays put in (22 samples = 0.5 ms at 44.1 kHz, a 17 cm path difference).
    expect(alignChannels([x, delayed(x, 22, 0.8)], sampleRate)).toEqual({ signs: [1, 1], lags: [0, 22] })
    expect(alignChannels([delayed(x, 9, 0.7), x], sampleRate)).toEqual({ signs: [1, 1], lags: [9, 0] })
    expect(alignChannels([x, delayed(x, -30, 0.9)], sampleRate)).toEqual({ signs: [1, 1], lags: [0, -30] })
  })

  it('inverts a delayed channel of opposite polarity, leaves a coincident pair and a dead channel as they are', () => {
    const x = strike(6)
    expect(alignChannels([x, delayed(x, 15, -0.9)], sampleRate)).toEqual({ signs: [1, -1], lags: [0, 15] })
    expect(alignChannels([x, delayed(x, 0, 0.5)], sampleRate)).toEqual({ signs: [1, 1], lags: [0, 0] })
    expect(alignChannels([x, delayed(x, 40, 0.001)], sampleRate)).toEqual({ signs: [1, 0], lags: [0, 0] })
  })

  it('does not shift a channel that holds no copy of the strike (unrelated noise)', () => {
    const random = seededRandom(9)
    const x = strike(7)
    const noise = Float64Array.from(x, () => 0.05 * random.normal())
    expect(alignChannels([x, noise], sampleRate).lags).toEqual([0, 0])
  })

  it('a spaced pair mixed after alignment keeps the partial the plain average cancels', () => {
    const x = strike(5)
    const far = delayed(x, 22)
    const { signs, lags } = alignChannels([x, far], sampleRate)
    // source: a 0.5 ms delay puts the plain average's first comb null at 1/(2·0.5 ms) = 1 kHz.
    const level = (y: Float64Array) => {
      let re = 0
      let im = 0
      for (let i = Math.round(0.2 * sampleRate); i < Math.round(0.4 * sampleRate); i++) {
        re += y[i]! * Math.cos((2 * Math.PI * 1000 * i) / sampleRate)
        im += y[i]! * Math.sin((2 * Math.PI * 1000 * i) / sampleRate)
      }
      return Math.hypot(re, im)
    }
    const aligned = level(mixToMono([x, far], signs, lags))
    expect(aligned / level(x)).toBeCloseTo(1, 2)
    expect(level(mixToMono([x, far])) / level(x)).toBeLessThan(0.05)
  })
})
