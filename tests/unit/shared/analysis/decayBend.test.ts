import { describe, expect, it } from 'vitest'
import { decayBendDbPerS } from '../../../../shared/analysis/decayBend'
import { fitLine } from '../../../../shared/analysis/fitLine'
import { seededRandom } from '../../../support/seededRandom'

// Frame levels of a decaying partial, 10 ms apart, with seeded Gaussian jitter of the level.
function curve(levelAt: (tS: number) => number, frames: number, jitterDb: number, seed: number) {
  const random = seededRandom(seed)
  const timesS = Array.from({ length: frames }, (_, i) => 0.2 + 0.01 * i)
  return { timesS, levelsDb: timesS.map(t => levelAt(t) + jitterDb * random.normal()), weights: timesS.map(() => 1) }
}

/** Power sum in dB of a partial (0 dB at 0.2 s) and a room's slower tail of it, `tailDb` under it there. */
const withTail = (decayDbPerS: number, tailDb: number, tailDbPerS: number) => (t: number) =>
  10 * Math.log10(10 ** (-decayDbPerS * (t - 0.2) / 10) + 10 ** ((tailDb - tailDbPerS * (t - 0.2)) / 10))

describe('decayBendDbPerS', () => {
  it('is zero for one exponential decay, a straight line in dB', () => {
    // source: a parabola through points on a line is that line, so its slope is the line's everywhere.
    const { timesS, levelsDb, weights } = curve(t => -3 - 140 * t, 30, 0, 1)
    expect(Math.abs(decayBendDbPerS(timesS, levelsDb, weights))).toBeLessThan(1e-9)
  })

  it('bends by about what a room tail rising under the partial takes off the line\'s decay', () => {
    // A 140 dB/s partial with a tail 25 dB under it decaying at 60 dB/s, over 0.3 s (the tail
    // comes within 3 dB of it at the end): the line reads the decay slow. The allowance the
    // uncertainty takes from the bend (bend / √3, a rectangular distribution) covers that error
    // without making it more than twice as large. source: the synthesised decay, 140 dB/s.
    const { timesS, levelsDb, weights } = curve(withTail(140, -25, 60), 31, 0, 1)
    const lineError = 140 + fitLine(timesS, levelsDb, weights).slope
    const allowance = decayBendDbPerS(timesS, levelsDb, weights) / Math.sqrt(3)
    expect(lineError).toBeGreaterThan(5)
    expect(allowance).toBeGreaterThan(lineError)
    expect(allowance).toBeLessThan(2 * lineError)
  })

  it('takes out what the noise alone bends: about a third of noisy straight decays keep a bend', () => {
    // b̂² − var b̂ > 0 where |b̂| exceeds its standard deviation: for a normal estimate, in 31.7 %
    // of cases (source: standard normal table, P(|Z| > 1) = 0.3173, from memory). With the
    // variance off by a factor 4 either way it would be 4.6 % or 61.7 %.
    let bent = 0
    const trials = 400
    for (let seed = 1; seed <= trials; seed++) {
      const { timesS, levelsDb, weights } = curve(t => -120 * t, 25, 0.8, seed)
      if (decayBendDbPerS(timesS, levelsDb, weights) !== 0) bent++
    }
    expect(bent / trials).toBeGreaterThan(0.2)
    expect(bent / trials).toBeLessThan(0.45)
  })

  it('is zero with too few points to see a bend, and refuses arrays that do not match', () => {
    expect(decayBendDbPerS([0, 0.01, 0.02, 0.03], [0, -1, -3, -6], [1, 1, 1, 1])).toBe(0)
    expect(() => decayBendDbPerS([0, 0.01], [0], [1, 1])).toThrow(RangeError)
  })
})
