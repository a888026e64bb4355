import { thicknessAtMm } from './thicknessAtMm'
import type { ProfileStation } from './types'

/**
 * The deepest cut allowed at each station: at most `maxDepthMm`, and shallow enough that
 * the bar stays at least `minThicknessMm` thick everywhere the cut reaches (from the
 * neighbouring station on one side to the one on the other). Since the removal is a
 * blend of neighbouring cuts, each within its limit over its reach, the blend is too.
 */
export function cutDepthLimitsMm(profile: readonly ProfileStation[], stationsMm: readonly number[], options: { maxDepthMm: number, minThicknessMm: number }): Float64Array {
  if (!(options.maxDepthMm >= 0) || !(options.minThicknessMm >= 0)) throw new RangeError('limits must not be negative')
  return Float64Array.from(stationsMm, (x, j) => {
    const from = stationsMm[j - 1] ?? x
    const to = stationsMm[j + 1] ?? x
    let thinnest = Math.min(thicknessAtMm(profile, from), thicknessAtMm(profile, to), thicknessAtMm(profile, x))
    for (const p of profile) if (p.xMm > from && p.xMm < to) thinnest = Math.min(thinnest, p.thicknessMm)
    return Math.max(0, Math.min(options.maxDepthMm, thinnest - options.minThicknessMm))
  })
}
