import { describe, expect, it } from 'vitest'
import { findStrike } from '../../../../shared/analysis/findStrike'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 48000

describe('findStrike', () => {
  // One partial at −6 dBFS decaying 20 dB/s, struck at 0.2 s, in white noise of −80 dBFS RMS.
  const x = synthStrike([{ frequencyHz: 523.25, amplitudeDb: -6, decayDbPerS: 20 }], { sampleRate, durationS: 5, onsetS: 0.2, noiseDb: -80, seed: 2 })
  const strike = findStrike(x, sampleRate, { attackSkipS: 0.005 })

  it('puts the onset at the strike and skips the attack after it', () => {
    expect(Math.abs(strike.onsetIndex - 0.2 * sampleRate)).toBeLessThanOrEqual(48) // within 1 ms
    expect(strike.startIndex - strike.onsetIndex).toBe(240) // 5 ms at 48 kHz
  })

  it('reads the levels of the noise and of the loudest block', () => {
    // source: white noise's RMS is its level; a sinusoid's RMS is its peak − 3.01 dB (common practice)
    expect(Math.abs(strike.noiseFloorDb - -80)).toBeLessThan(1.5)
    expect(Math.abs(strike.peakDb - (-6 - 3.01))).toBeLessThan(0.3)
  })

  it('ends where the decaying partial sinks to 6 dB over the noise', () => {
    // RMS −9 dB at the onset, falling 20 dB/s to −74 dB: (74 − 9) / 20 = 3.25 s after it.
    const endS = strike.endIndex / sampleRate
    expect(Math.abs(endS - (0.2 + 3.25))).toBeLessThan(0.15)
  })

  it('finds a strike at the very start, and refuses a recording of under four blocks', () => {
    const early = synthStrike([{ frequencyHz: 800, amplitudeDb: -10, decayDbPerS: 30 }], { sampleRate, durationS: 1, noiseDb: -90, seed: 3 })
    expect(findStrike(early, sampleRate, { attackSkipS: 0.005 }).onsetIndex).toBeLessThan(48)
    expect(() => findStrike(new Float64Array(100), sampleRate, { attackSkipS: 0.005 })).toThrow(RangeError)
  })

  it('puts the onset at the strike, not in mains hum before it', () => {
    // 60 Hz hum at −40 dBFS peak from the start (its 1 ms blocks dip 20 dB at the zero crossings),
    // a strike of −8 dBFS at 0.3 s decaying 50 dB/s.
    const struck = synthStrike([{ frequencyHz: 408.5, amplitudeDb: -8, decayDbPerS: 50 }], { sampleRate, durationS: 3, onsetS: 0.3, noiseDb: -80, seed: 4 })
    const hummed = struck.map((v, i) => v + 0.01 * Math.sin((2 * Math.PI * 60 * i) / sampleRate))
    const found = findStrike(hummed, sampleRate, { attackSkipS: 0.005 })
    expect(Math.abs(found.onsetIndex - 0.3 * sampleRate)).toBeLessThanOrEqual(48) // within 1 ms
  })

  it('reads the floor from the recording, not from digital silence an editor put before and after it', () => {
    // The strike above with 0.2 s of zeros before it and 1 s after: zeros hold no noise, and a floor
    // read from them (−300 dB) let the strike run on to the last sample before the zeros.
    const lead = 0.2 * sampleRate
    const padded = new Float64Array(x.length + lead + sampleRate)
    padded.set(x, lead)
    const found = findStrike(padded, sampleRate, { attackSkipS: 0.005 })
    expect(Math.abs(found.noiseFloorDb - strike.noiseFloorDb)).toBeLessThan(0.5)
    expect(Math.abs(found.onsetIndex - (strike.onsetIndex + lead))).toBeLessThanOrEqual(48) // within 1 ms
    expect(Math.abs(found.endIndex - (strike.endIndex + lead)) / sampleRate).toBeLessThan(0.05)
  })

  it('runs a take stopped while the piece still rings, with no lead-in, to its end', () => {
    // Struck at the first sample and cut 0.6 s on, at −25 dB: the quietest tenth is the piece itself,
    // 6 dB over which the strike once ended at 0.24 s, with half the take unread.
    const cut = synthStrike([{ frequencyHz: 1046.5, amplitudeDb: -10, decayDbPerS: 20 }], { sampleRate, durationS: 0.6, noiseDb: -90, seed: 6 })
    const found = findStrike(cut, sampleRate, { attackSkipS: 0.005 })
    expect(found.endIndex).toBeGreaterThan(cut.length - 48)
  })

  it('ends where the sound meets the floor when an editor faded the background out after it', () => {
    // 60 dB/s from −10 dB into noise of −70 dB by about 0.9 s; the last 1.5 s faded by 10 dB. The fade falls,
    // as a ringing piece does, but what falls is noise, not a line.
    const faded = synthStrike([{ frequencyHz: 1046.5, amplitudeDb: -10, decayDbPerS: 60 }], { sampleRate, durationS: 3, noiseDb: -70, seed: 7 })
    const fade = 1.5 * sampleRate
    for (let i = 0; i < fade; i++) faded[faded.length - fade + i]! *= 10 ** ((-10 * i) / fade / 20)
    const found = findStrike(faded, sampleRate, { attackSkipS: 0.005 })
    expect(found.endIndex / sampleRate).toBeLessThan(2)
  })
})
