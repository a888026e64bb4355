import { describe, expect, it } from 'vitest'
import { findEarlierSound } from '../../../../shared/analysis/findEarlierSound'
import { findStrike } from '../../../../shared/analysis/findStrike'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 48000
const bar = [
  { frequencyHz: 523.25, amplitudeDb: -8, decayDbPerS: 40, phaseRad: 0 },
  { frequencyHz: 1569.8, amplitudeDb: -20, decayDbPerS: 90, phaseRad: 1 },
]

/** A first strike at 0.2 s, then a second 3 dB louder at 2.0 s, after the first has died away. */
function twoStrikes(): Float64Array {
  const first = synthStrike(bar, { sampleRate, durationS: 3, onsetS: 0.2, noiseDb: -90, seed: 11 })
  const second = synthStrike(bar, { sampleRate, durationS: 3, onsetS: 2.0 })
  return first.map((v, i) => v + 1.41 * second[i]!)
}

describe('findEarlierSound', () => {
  it('finds a full strike that died away before the louder strike findStrike takes', () => {
    const x = twoStrikes()
    const strike = findStrike(x, sampleRate, { attackSkipS: 0.005 })
    // source: the synthesised onsets, 0.2 s and 2.0 s (1 ms blocks).
    expect(strike.onsetIndex / sampleRate).toBeCloseTo(2.0, 2)
    const earlier = findEarlierSound(x, sampleRate, strike.onsetIndex, strike.peakDb)
    expect(earlier).not.toBeNull()
    expect(earlier! / sampleRate).toBeGreaterThanOrEqual(0.199)
    expect(earlier! / sampleRate).toBeLessThanOrEqual(0.202)
  }, 60_000)

  it('finds nothing before a single strike, nor in a steady rumble as loud as an earlier strike would be', () => {
    const single = synthStrike(bar, { sampleRate, durationS: 2, onsetS: 0.5, noiseDb: -80, seed: 12 })
    const s1 = findStrike(single, sampleRate, { attackSkipS: 0.005 })
    expect(findEarlierSound(single, sampleRate, s1.onsetIndex, s1.peakDb)).toBeNull()
    // A 25 Hz rumble 15 dB under the strike's loudest block from the first sample on: its 1 ms
    // blocks swing with the wave, but never 20 dB over its own mean.
    const rumble = Float64Array.from(single, (v, i) => v + 0.06 * Math.sin((2 * Math.PI * 25 * i) / sampleRate))
    const s2 = findStrike(rumble, sampleRate, { attackSkipS: 0.005 })
    expect(findEarlierSound(rumble, sampleRate, s2.onsetIndex, s2.peakDb)).toBeNull()
  }, 60_000)

  it('does not search the 20 ms before the onset, and refuses a bad rate or level', () => {
    const x = twoStrikes()
    const onset = Math.round(0.21 * sampleRate)
    expect(findEarlierSound(x, sampleRate, onset, -10)).toBeNull()
    expect(() => findEarlierSound(x, 0, onset, -10)).toThrow(RangeError)
    expect(() => findEarlierSound(x, sampleRate, onset, Number.NaN)).toThrow(RangeError)
  })
})
