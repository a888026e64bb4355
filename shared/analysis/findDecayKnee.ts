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
  // Weighted sums from the start (times and levels taken from the first point's, against
  // cancellation), so each stage's line is O(1): every split is tried.
  const sums = prefixSums(timesS, levelsDb, weights)
  const residual = (from: number, to: number) => lineOver(sums, from, to)
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

/** Running Σw, Σwx, Σwy, Σwx², Σwxy, Σwy² (x, y from the first point's), one more entry than points. */
function prefixSums(timesS: readonly number[], levelsDb: readonly number[], weights: readonly number[]): Float64Array[] {
  const n = timesS.length
  const out = Array.from({ length: 6 }, () => new Float64Array(n + 1))
  const [w, wx, wy, wxx, wxy, wyy] = out as [Float64Array, Float64Array, Float64Array, Float64Array, Float64Array, Float64Array]
  for (let i = 0; i < n; i++) {
    const x = timesS[i]! - timesS[0]!
    const y = levelsDb[i]! - levelsDb[0]!
    const v = weights[i]!
    w[i + 1] = w[i]! + v
    wx[i + 1] = wx[i]! + v * x
    wy[i + 1] = wy[i]! + v * y
    wxx[i + 1] = wxx[i]! + v * x * x
    wxy[i + 1] = wxy[i]! + v * x * y
    wyy[i + 1] = wyy[i]! + v * y * y
  }
  return out
}

/** The weighted least-squares line over points from…to−1: its weighted squared residual and its decay (−slope). */
function lineOver(sums: Float64Array[], from: number, to: number): { sum: number, decayDbPerS: number } {
  const [w, wx, wy, wxx, wxy, wyy] = sums.map(s => s[to]! - s[from]!) as [number, number, number, number, number, number]
  if (!(w > 0)) return { sum: 0, decayDbPerS: 0 }
  const sxx = wxx - (wx * wx) / w
  const sxy = wxy - (wx * wy) / w
  const syy = wyy - (wy * wy) / w
  if (!(sxx > 0)) return { sum: Math.max(0, syy), decayDbPerS: 0 }
  return { sum: Math.max(0, syy - (sxy * sxy) / sxx), decayDbPerS: -sxy / sxx }
}
