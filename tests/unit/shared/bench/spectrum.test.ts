import { describe, expect, it } from 'vitest'
import { magnitudeSpectrum, roughPitch } from '../../../../shared/bench/spectrum'
import { synthStrike } from '../../../support/synthStrike'

describe('browser spectrum', () => {
  it('reads a full-scale sine on a bin as 0 dB at its frequency', () => {
    const rate = 48000
    const size = 16384
    const f = (1000 * rate) / size // exactly bin 1000
    const x = synthStrike([{ frequencyHz: f, amplitudeDb: 0, decayDbPerS: 0 }], { sampleRate: rate, durationS: 0.5 })
    const s = magnitudeSpectrum(x, rate, 0, size)
    expect(s.frequencyHz.length).toBe(size / 2)
    const k = s.levelDb.indexOf(Math.max(...s.levelDb))
    expect(s.frequencyHz[k]).toBeCloseTo(f, 6)
    // source: Harris (1978), coherent gain of a window = Σw / N; with 2|X|/Σw a sinusoid reads its amplitude
    expect(s.levelDb[k]).toBeCloseTo(0, 2)
  })

  it('gives a rough pitch within a few cents of a synthetic strike', () => {
    const rate = 44100
    const x = synthStrike([{ frequencyHz: 261.63, amplitudeDb: -6, decayDbPerS: 10 }, { frequencyHz: 1046.5, amplitudeDb: -20, decayDbPerS: 20 }], { sampleRate: rate, durationS: 0.5, noiseDb: -80 })
    const p = roughPitch(x, rate)!
    expect(Math.abs(1200 * Math.log2(p.frequencyHz / 261.63))).toBeLessThan(5)
  })
})
