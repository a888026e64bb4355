import { fitLine } from './fitLine'

export interface KneeSettings {
  /** Least fall of the first stage, dB (ISO 3382-1 reads a decay over 20 dB, T20). */
  minFirstFallDb: number
  /** The later stage decays at most this share of the first stage's rate. */
  maxRateShare: number
  /** The two lines leave at most this share of the one line's weighted squared residual. */
  maxResidualShare: number
  /** The later stage never comes back within this of the first frame's level, dB (a beat does). */
  minTailBelowDb: number
  /** Fewest points in each stage. */
  minPoints: number
}

export const KNEE_SETTINGS: KneeSettings = { minFirstFallDb: 20, maxRateShare: 1 / 3, maxResidualShare: 1 / 4, minTailBelowDb: 15, minPoints: 5 }

/**
 * Where a decay curve of levels (dB at `timesS`) turns from a fast first stage into a much slower
 * second one (a double-slope decay: a short-lived partial whose own sound has died under a room's
 * reverberant tail of it), as the number of points in the first stage; null when the curve is one
 * decay. The split is the one that minimises the two lines' weighted squared residual (two-stage
 * decay fitting, Xiang, JASA 98(4), 1995); it is kept only when the first stage falls at least
 * 20 dB (the range ISO 3382-1 reads a decay over), the second decays at most a third as fast and
 * never comes back within 15 dB of the start (so a beat's null is no knee), and the two lines fit
 * four times better than one.
 */
export function findDecayKnee(
  timesS: readonly number[],
  levelsDb: readonly number[],
  weights: readonly number[],
  settings: KneeSettings = KNEE_SETTINGS,
): number | null {
  const n = timesS.length
  if (levelsDb.length !== n || weights.length !== n) throw new RangeError('findDecayKnee needs one level and one weight per time')
  const m = settings.minPoints
  if (n < 2 * m) return null
  const residual = (from: number, to: number) => {
    const fit = fitLine(timesS.slice(from, to), levelsDb.slice(from, to), weights.slice(from, to))
    let sum = 0
    for (let i = 0; i < fit.residuals.length; i++) sum += weights[from + i]! * fit.residuals[i]! ** 2
    return { sum, decayDbPerS: -fit.slope }
  }
  const whole = residual(0, n).sum
  // The tail's highest level after each split (from the end backwards).
  const tailMax = new Float64Array(n + 1).fill(-Infinity)
  for (let i = n - 1; i >= 0; i--) tailMax[i] = Math.max(tailMax[i + 1]!, levelsDb[i]!)
  let best: { k: number, sum: number } | null = null
  for (let k = m; k <= n - m; k++) {
    if (tailMax[k]! > levelsDb[0]! - settings.minTailBelowDb) continue
    const first = residual(0, k)
    const second = residual(k, n)
    if (first.decayDbPerS * (timesS[k - 1]! - timesS[0]!) < settings.minFirstFallDb) continue
    if (second.decayDbPerS > settings.maxRateShare * first.decayDbPerS) continue
    const sum = first.sum + second.sum
    if (!best || sum < best.sum) best = { k, sum }
  }
  return best && best.sum <= settings.maxResidualShare * whole ? best.k : null
}
