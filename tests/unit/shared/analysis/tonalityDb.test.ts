import { describe, expect, it } from 'vitest'
import { tonalityDb } from '../../../../shared/analysis/tonalityDb'
import { seededRandom } from '../../../support/seededRandom'

const n = 8192
const noise = (seed: number, level: number) => {
  const { normal } = seededRandom(seed)
  return Float64Array.from({ length: n }, () => level * normal())
}

describe('tonalityDb', () => {
  it('reads white noise as about ln n over the median: no line', () => {
    // source: the largest of m exponential bin powers lies near ln m over their mean, and the median is ln 2 of
    // the mean (Kay 1998, §9.5): ln(3900)/ln 2 = 11.9, i.e. 10.8 dB; the scatter of the maximum adds a few dB.
    for (const seed of [1, 2, 3]) {
      const t = tonalityDb(noise(seed, 1e-3))
      expect(t).toBeGreaterThan(8)
      expect(t).toBeLessThan(18)
    }
  })

  it('reads a decaying partial 40 dB over the noise per bin as a line tens of dB over it', () => {
    const x = noise(4, 1e-4)
    for (let i = 0; i < n; i++) x[i]! += 0.01 * Math.exp(-i / 20000) * Math.sin((2 * Math.PI * 523.25 * i) / 48000)
    expect(tonalityDb(x)).toBeGreaterThan(40)
  })

  it('reads low-passed noise (a room\'s rumble) and a sparse scatter of samples as no line', () => {
    const white = noise(5, 1e-3)
    const rumble = new Float64Array(n)
    // One-pole low-pass at about 300 Hz (48 kHz): its spectrum falls 6 dB per octave above it.
    for (let i = 1; i < n; i++) rumble[i] = 0.96 * rumble[i - 1]! + white[i]!
    expect(tonalityDb(rumble)).toBeLessThan(30)
    const sparse = new Float64Array(n)
    const { uniform } = seededRandom(6)
    for (let i = 0; i < n; i++) if (uniform() < 0.01) sparse[i] = uniform() < 0.5 ? -3e-5 : 3e-5
    expect(tonalityDb(sparse)).toBeLessThan(20)
  })

  it('refuses a length that is not a power of two of at least 64', () => {
    expect(() => tonalityDb(new Float64Array(100))).toThrow(RangeError)
    expect(() => tonalityDb(new Float64Array(32))).toThrow(RangeError)
  })
})
