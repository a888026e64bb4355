import { describe, expect, it } from 'vitest'
import { findDecayKnee } from '../../../../shared/analysis/findDecayKnee'
import { seededRandom } from '../../../support/seededRandom'

// Frame levels of a decaying partial, 2 ms apart (an 8 ms window's quarter hop), with seeded
// Gaussian jitter of the level; weights all 1.
function curve(levelAt: (tS: number) => number, frames: number, jitterDb: number, seed: number) {
  const random = seededRandom(seed)
  const timesS = Array.from({ length: frames }, (_, i) => 0.002 * i)
  return { timesS, levelsDb: timesS.map(t => levelAt(t) + jitterDb * random.normal()), weights: timesS.map(() => 1) }
}

/** Power sum of two exponential decays in dB: a partial (onset 0 dB) and a room's tail of it. */
const twoStage = (fastDbPerS: number, tailDb: number, tailDbPerS: number) => (t: number) =>
  10 * Math.log10(10 ** (-fastDbPerS * t / 10) + 10 ** ((tailDb - tailDbPerS * t) / 10))

describe('findDecayKnee', () => {
  it('splits a short-lived partial (600 dB/s) from a room tail 30 dB under it (50 dB/s) where the two cross', () => {
    // source: the two lines cross where 600 t = 30 + 50 t, t = 54.5 ms, frame 27.
    const { timesS, levelsDb, weights } = curve(twoStage(600, -30, 50), 80, 0.5, 3)
    const knee = findDecayKnee(timesS, levelsDb, weights)
    expect(knee).not.toBeNull()
    expect(Math.abs(knee! - 27)).toBeLessThanOrEqual(3)
  })

  it('finds no knee in one exponential decay, however long or noisy', () => {
    for (const seed of [1, 2, 3]) {
      const { timesS, levelsDb, weights } = curve(t => -200 * t, 100, 1.5, seed)
      expect(findDecayKnee(timesS, levelsDb, weights)).toBeNull()
    }
  })

  it('finds no knee where the level comes back near where it started (a beat\'s recovery)', () => {
    // A fall of 30 dB in 50 ms, then a rise back to 5 dB under the start (a pair beating out of its null).
    const { timesS, levelsDb, weights } = curve(t => (t < 0.05 ? -600 * t : -30 + 167 * (t - 0.05)), 100, 0.3, 4)
    expect(findDecayKnee(timesS, levelsDb, weights)).toBeNull()
    // The same fall under a tail that stays 20 dB down is a knee.
    const tail = curve(t => (t < 0.05 ? -600 * t : -30 + 50 * (t - 0.05) * (t < 0.1 ? 1 : 0)), 100, 0.3, 4)
    expect(findDecayKnee(tail.timesS, tail.levelsDb, tail.weights)).not.toBeNull()
  })

  it('finds no knee where the first stage falls less than 20 dB (ISO 3382-1\'s T20 range)', () => {
    // source: a tail 15 dB under the onset meets the fast decay after a 15 dB fall.
    const { timesS, levelsDb, weights } = curve(twoStage(600, -15, 50), 80, 0.3, 5)
    expect(findDecayKnee(timesS, levelsDb, weights)).toBeNull()
  })

  it('needs one weight and one level per time', () => {
    expect(() => findDecayKnee([0, 1], [0], [1, 1])).toThrow(RangeError)
  })
})
