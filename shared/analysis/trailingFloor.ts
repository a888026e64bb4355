/**
 * Noise floor by minimum statistics (Martin 2001, IEEE Trans. Speech Audio Process. 9(5)):
 * the noise is what stays when the strike has died away, so a frame's floor is the lowest
 * banded floor (bandNoiseFloor) of this frame and every later one. Early in a dense strike
 * (timpani, steel note fields) the banded floor is the skirts of neighbouring partials, which
 * decay with them; a weaker partial among them stands over the noise all the same.
 * The floor is lowered by at most `maxReliefDb`, so a peak must still stand that much less
 * than the noise margin over the skirts around it: over the noise by the margin, over its
 * neighbours' skirts by (margin − relief). Frames are given last first; `trailing` carries
 * the minimum (start it at Infinity). Lowers `floor[kMin…kMax]` in place and returns it.
 */
export function trailingFloor(floor: Float64Array, trailing: Float64Array, kMin: number, kMax: number, maxReliefDb: number): Float64Array {
  if (trailing.length < kMax + 1 || floor.length < kMax + 1) throw new RangeError('trailingFloor needs arrays covering kMax')
  if (!(maxReliefDb >= 0)) throw new RangeError('trailingFloor needs a relief ≥ 0 dB')
  const relief = 10 ** (-maxReliefDb / 10)
  for (let k = kMin; k <= kMax; k++) {
    const f = floor[k]!
    const t = trailing[k]!
    if (f < t) trailing[k] = f
    else floor[k] = Math.max(t, f * relief)
  }
  return floor
}
