import { describe, expect, it } from 'vitest'
import { StrikeTrigger } from '../../../../shared/bench/strikeTrigger'
import { synthStrike } from '../../../support/synthStrike'

const RATE = 48000

function feed(trigger: StrikeTrigger, signal: Float64Array, block = 2048) {
  let doneAt = -1
  for (let i = 0; i < signal.length; i += block) {
    const state = trigger.push(Float32Array.from(signal.subarray(i, i + block)))
    if (state === 'done' && doneAt < 0) doneAt = i + block
  }
  return doneAt
}

describe('automatic strike capture', () => {
  it('starts at the strike with the pre-roll and ends in the noise floor', () => {
    // 1 s of noise at −70 dB, then a strike decaying at 40 dB/s from −10 dB.
    const signal = synthStrike([{ frequencyHz: 440, amplitudeDb: -10, decayDbPerS: 40 }], { sampleRate: RATE, durationS: 4, onsetS: 1, noiseDb: -70, seed: 3 })
    const trigger = new StrikeTrigger({ sampleRate: RATE, maxS: 10 })
    const doneAt = feed(trigger, signal)
    expect(trigger.state).toBe('done')
    const take = trigger.take()
    // The onset sits at the pre-roll (0.1 s) into the take, within one block.
    const firstLoud = take.findIndex(v => Math.abs(v) > 0.01)
    expect(Math.abs(firstLoud - 0.1 * RATE)).toBeLessThan(2048)
    // −10 dB peak (−13 dB RMS) falls to the −70 dB floor + 6 dB margin after about 51/40 ≈ 1.3 s.
    const lengthS = take.length / RATE
    expect(lengthS).toBeGreaterThan(1.1)
    expect(lengthS).toBeLessThan(1.8)
    expect(doneAt / RATE).toBeLessThan(3)
    expect(trigger.noiseFloorDb).toBeGreaterThan(-73)
    expect(trigger.noiseFloorDb).toBeLessThan(-67)
  })

  it('stops at the maximum length for a long ring', () => {
    const signal = synthStrike([{ frequencyHz: 220, amplitudeDb: -6, decayDbPerS: 5 }], { sampleRate: RATE, durationS: 6, onsetS: 0.5, noiseDb: -80, seed: 4 })
    const trigger = new StrikeTrigger({ sampleRate: RATE, maxS: 3 })
    feed(trigger, signal)
    expect(trigger.take().length).toBe(3 * RATE)
  })

  it('does not take a piece already ringing when armed for a new strike', () => {
    const signal = synthStrike([{ frequencyHz: 300, amplitudeDb: -6, decayDbPerS: 30 }], { sampleRate: RATE, durationS: 3, onsetS: 0, noiseDb: -75, seed: 5 })
    const trigger = new StrikeTrigger({ sampleRate: RATE })
    feed(trigger, signal)
    expect(trigger.state).toBe('waiting')
  })

  it('stays waiting in plain noise and records on a manual start until stopped', () => {
    const noise = synthStrike([], { sampleRate: RATE, durationS: 1, noiseDb: -60, seed: 6 })
    const trigger = new StrikeTrigger({ sampleRate: RATE })
    feed(trigger, noise)
    expect(trigger.state).toBe('waiting')
    trigger.start()
    feed(trigger, noise.subarray(0, RATE / 2))
    trigger.stop()
    expect(trigger.state).toBe('done')
    expect(trigger.take().length).toBeGreaterThanOrEqual(RATE / 2)
  })

  it('counts a gap of digital silence inside the ring as a dropout, and none in a clean take', () => {
    const clean = synthStrike([{ frequencyHz: 262, amplitudeDb: -8, decayDbPerS: 12 }], { sampleRate: RATE, durationS: 4, onsetS: 0.6, noiseDb: -78, seed: 8 })
    const plain = new StrikeTrigger({ sampleRate: RATE })
    feed(plain, clean)
    expect(plain.state).toBe('done')
    expect(plain.dropouts).toBe(0)
    // 10 ms of exact zeros at 1.4 s, as an audio path that underran delivers them.
    const gapped = new Float64Array(clean.length + 480)
    const at = Math.round(2.0 * RATE)
    gapped.set(clean.subarray(0, at), 0)
    gapped.set(clean.subarray(at), at + 480)
    const trigger = new StrikeTrigger({ sampleRate: RATE })
    feed(trigger, gapped)
    expect(trigger.dropouts).toBe(1)
  })
})
