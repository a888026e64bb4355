import { describe, expect, it } from 'vitest'
import { fitLine } from '../../../../shared/analysis/fitLine'
import { LINE_PULL_SHARE, partialUncertaintyCents } from '../../../../shared/analysis/partialUncertaintyCents'
import { seededRandom } from '../../../../shared/synthesis/seededRandom'

describe('partialUncertaintyCents', () => {
  it('adds the bound, the spread of two readings (Δ/√2) and 5 % of the line\'s half-width in quadrature', () => {
    // 600 dB/s (T60 0.1 s) is α = 69.08 Np/s, a half-width α/2π = 10.994 Hz: at 3 kHz that is
    // 1200·log2(1 + 10.994/3000) = 6.3328 ¢ (source: a damped sinusoid's Lorentzian line, half-width
    // at half power α/2π, common practice).
    const line = LINE_PULL_SHARE * 6.3328
    expect(partialUncertaintyCents(0.03, 0.2, 3000, 600)).toBeCloseTo(Math.hypot(0.03, 0.2 / Math.SQRT2, line), 4)
    expect(partialUncertaintyCents(0, 0, 3000, 600)).toBeCloseTo(line, 4)
  })

  it('adds nothing for a line that does not decay, and next to nothing for a chime\'s slow one', () => {
    expect(partialUncertaintyCents(0.01, 0.02, 440, 0)).toBeCloseTo(Math.hypot(0.01, 0.02 / Math.SQRT2), 12)
    expect(partialUncertaintyCents(0.01, 0.02, 440, -3)).toBeCloseTo(Math.hypot(0.01, 0.02 / Math.SQRT2), 12)
    // 3 dB/s at 523 Hz: half-width 0.055 Hz = 0.18 ¢, allowance 0.009 ¢.
    expect(partialUncertaintyCents(0, 0, 523.25, 3)).toBeLessThan(0.01)
  })

  it('carries the decay\'s pull into the frequency: u_α in nepers/s is u_ω in rad/s', () => {
    // 8.6859 dB/s is 1 Np/s (20/ln 10 dB per neper, ISO 80000-3): 1/2π Hz = 0.159155 Hz, at 1 kHz
    // 1200·log2(1 + 0.159155/1000) = 0.275513 ¢ (arithmetic).
    const pull = 0.275513
    expect(partialUncertaintyCents(0, 0, 1000, 0, 20 / Math.LN10)).toBeCloseTo(pull, 5)
    expect(partialUncertaintyCents(0.1, 0.2, 1000, 0, -20 / Math.LN10)).toBeCloseTo(Math.hypot(0.1, 0.2 / Math.SQRT2, pull), 5)
  })

  it('adds pulls of level and phase alike: another sound of unrelated phase moves the decay (Np/s) and the angular frequency (rad/s) by the same amount in RMS', () => {
    // A partial e^{(−α + iω)t} plus a reflection 20 dB under it, 3 Hz away, of random phase; over 0.2 s at
    // 2 kHz, straight lines through log|z| and the unwrapped phase give the decay and the frequency.
    // source: log(1 + ε) = Σ (−1)^{k+1} ε^k / k for |ε| < 1, whose real part moves the log level and whose
    // imaginary part the phase; each term's phase is uniform when ε's is, so both parts have the same
    // variance (algebra).
    const random = seededRandom(11)
    const rate = 2000
    const n = 400
    const t = Float64Array.from({ length: n }, (_, j) => j / rate)
    let sumDecay = 0
    let sumOmega = 0
    for (let trial = 0; trial < 400; trial++) {
      const phi = 2 * Math.PI * random.uniform()
      const level = new Float64Array(n)
      const phase = new Float64Array(n)
      let unwrap = 0
      let last = 0
      for (let j = 0; j < n; j++) {
        // In the partial's own frame (its decay and rotation divided out): the reflection dies 10 Np/s slower than it.
        const g = 0.1 * Math.exp(10 * t[j]!)
        const re = 1 + g * Math.cos(2 * Math.PI * 3 * t[j]! + phi)
        const im = g * Math.sin(2 * Math.PI * 3 * t[j]! + phi)
        level[j] = Math.log(Math.hypot(re, im))
        const p = Math.atan2(im, re)
        unwrap += p - last - 2 * Math.PI * Math.round((p - last) / (2 * Math.PI))
        last = p
        phase[j] = unwrap
      }
      sumDecay += fitLine(t, level).slope ** 2
      sumOmega += fitLine(t, phase).slope ** 2
    }
    const ratio = Math.sqrt(sumOmega / sumDecay)
    expect(ratio).toBeGreaterThan(0.9)
    expect(ratio).toBeLessThan(1.1)
  })

  it('refuses a frequency that is not positive', () => {
    expect(() => partialUncertaintyCents(0, 0, 0, 10)).toThrow(RangeError)
    expect(() => partialUncertaintyCents(0, 0, Number.NaN, 10)).toThrow(RangeError)
  })
})
